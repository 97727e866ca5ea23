package org.spectralsieve.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;

/**
 * A plain-text table for a terminal: columns as wide as their widest cell, two spaces apart, numbers
 * right-aligned; each row may carry indented detail lines printed under it.
 */
final class TextTable {

    private static final String GAP = "  ";
    private static final String DETAIL_INDENT = "      ";

    private final List<String> headers;
    private final boolean[] rightAligned;
    private final List<Row> rows = new ArrayList<>();

    /** A row of cells, or (cells null) a heading printed across the table. */
    private record Row(List<String> cells, List<String> details, String heading) {
    }

    /** @param columns header names; a leading '>' marks a right-aligned column (and is not printed) */
    TextTable(List<String> columns) {
        this.headers = columns.stream().map(c -> c.startsWith(">") ? c.substring(1) : c).toList();
        this.rightAligned = new boolean[columns.size()];
        for (int i = 0; i < columns.size(); i++) {
            rightAligned[i] = columns.get(i).startsWith(">");
        }
    }

    void add(List<String> cells, List<String> details) {
        if (cells.size() != headers.size()) {
            throw new IllegalArgumentException("row has " + cells.size() + " cells, the table " + headers.size()
                    + " columns: " + cells);
        }
        rows.add(new Row(List.copyOf(cells), List.copyOf(details), null));
    }

    void add(List<String> cells) {
        add(cells, List.of());
    }

    /** A line printed across the table before the rows that follow, for groups of rows. */
    void heading(String text) {
        rows.add(new Row(null, List.of(), text));
    }

    void print(PrintWriter out) {
        int[] widths = new int[headers.size()];
        for (int i = 0; i < widths.length; i++) {
            widths[i] = headers.get(i).length();
            for (Row row : rows) {
                if (row.cells() != null) {
                    widths[i] = Math.max(widths[i], row.cells().get(i).length());
                }
            }
        }
        out.println(line(headers, widths));
        for (Row row : rows) {
            if (row.cells() == null) {
                out.println("-- " + row.heading());
                continue;
            }
            out.println(line(row.cells(), widths));
            row.details().forEach(d -> out.println(DETAIL_INDENT + d));
        }
        out.flush();
    }

    private String line(List<String> cells, int[] widths) {
        StringBuilder line = new StringBuilder();
        for (int i = 0; i < cells.size(); i++) {
            String cell = cells.get(i);
            String pad = " ".repeat(widths[i] - cell.length());
            line.append(i == 0 ? "" : GAP).append(rightAligned[i] ? pad + cell : cell + pad);
        }
        return line.toString().stripTrailing();
    }
}
