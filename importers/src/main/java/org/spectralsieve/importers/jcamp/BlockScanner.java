package org.spectralsieve.importers.jcamp;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import org.spectralsieve.importers.ImportException;

/**
 * Splits a file into blocks. {@code ##TITLE=} opens a block (nested inside an open LINK block),
 * {@code ##END=} closes the innermost one; lines after a data label up to the next label are data;
 * other unlabelled lines in a header continue the previous label's value (multi-line values).
 */
final class BlockScanner {

    /** A block being collected. */
    static final class Draft {
        final int index;
        final int startLine;
        int endLine;
        final List<Ldr> ldrs = new ArrayList<>();
        Ldr data;
        final IntBuffer dataLines = new IntBuffer();
        /** End of each data line without its comment, found once by the scanner. */
        final IntBuffer dataEnds = new IntBuffer();
        boolean inData;
        boolean extraTable;

        Draft(int index, int startLine) {
            this.index = index;
            this.startLine = startLine;
        }
    }

    private final String source;
    private final TextLines text;
    private final List<Draft> drafts = new ArrayList<>();
    private final Deque<Draft> open = new ArrayDeque<>();

    BlockScanner(String source, TextLines text) {
        this.source = source;
        this.text = text;
    }

    List<JcampBlock> scan() throws ImportException {
        for (int i = 0; i < text.count(); i++) {
            line(i);
        }
        for (Draft d : open) {
            if (d.data != null) {
                throw new ImportException(source, TextLines.number(text.count() - 1), Labels.field(Labels.END),
                        "the file ends inside the block opened at line " + d.startLine
                                + " (no ##END=): truncated?");
            }
        }
        List<JcampBlock> blocks = new ArrayList<>(drafts.size());
        for (Draft d : drafts) {
            blocks.add(new BlockDecoder(source, text, d).decode());
        }
        return blocks;
    }

    private void line(int i) throws ImportException {
        char[] c = text.chars;
        int start = text.start(i);
        int end = text.endWithoutComment(i);
        int p = start;
        while (p < end && (c[p] == ' ' || c[p] == '\t')) {
            p++;
        }
        if (p + 2 == end && c[p] == '#' && c[p + 1] == '#' && end < text.end(i)) {
            return; // "##$$ …": a label-shaped comment line
        }
        if (p + 1 < end && c[p] == '#' && c[p + 1] == '#') {
            label(i, p + 2, end);
            return;
        }
        Draft current = open.peek();
        if (current == null || p == end) {
            return; // text outside any block (comments, a stray Ctrl-Z) or an empty line
        }
        if (current.inData) {
            current.dataLines.add(i);
            current.dataEnds.add(end);
        } else if (!current.ldrs.isEmpty()) {
            int last = current.ldrs.size() - 1;
            current.ldrs.set(last, current.ldrs.get(last).withMoreValue(new String(c, p, end - p).strip()));
        }
    }

    private void label(int i, int from, int end) throws ImportException {
        char[] c = text.chars;
        int eq = from;
        while (eq < end && c[eq] != '=') {
            eq++;
        }
        String name = new String(c, from, eq - from).strip();
        String value = eq < end ? new String(c, eq + 1, end - eq - 1).strip() : "";
        String canonical = Labels.canonical(name);
        int lineNo = TextLines.number(i);
        if (canonical.isEmpty()) {
            throw new ImportException(source, lineNo, "##", "a label without a name");
        }
        Draft current = open.peek();
        if (current != null) {
            current.inData = false;
        } else if (canonical.equals(Labels.END)) {
            return; // a surplus ##END= after everything closed changes nothing
        }
        if (canonical.equals(Labels.TITLE) || current == null) {
            current = new Draft(drafts.size(), lineNo);
            drafts.add(current);
            open.push(current);
        }
        if (canonical.equals(Labels.END)) {
            current.endLine = lineNo;
            open.pop();
            return;
        }
        Ldr ldr = new Ldr(name, canonical, value, lineNo);
        current.ldrs.add(ldr);
        if (Labels.isDataTable(canonical)) {
            if (current.data == null) {
                current.data = ldr;
                current.inData = true;
            } else {
                current.extraTable = true;
            }
        }
    }
}
