package org.spectralsieve.importers;

import java.util.List;
import java.util.OptionalInt;

/**
 * The wavelength and value columns a user chose in the {@link ReadOptions} ({@code xColumn}, {@code yColumn},
 * counted from 1 as a spreadsheet shows them), for a file whose header names them wrongly, names them in a
 * way not recognised, or has no header. A column not chosen is taken as the header would give it (its first
 * wavelength or value column), or else the first column that is not the other one. The names still say
 * what they can: a wavelength unit or a percent sign in the chosen column's name is used unless the read
 * options force a unit or y kind.
 */
final class ChosenColumns {

    private ChosenColumns() {
    }

    static DelimitedTextReader.Series series(String source, TextTable.Header header, List<String> names,
            ReadOptions options, List<String> notes) throws ImportException {
        ColumnRole[] roles = roles(names, header.names() != null);
        int count = names.size();
        int x = chosen(source, header, "xColumn", options.xColumn(), count);
        int y = chosen(source, header, "yColumn", options.yColumn(), count);
        if (x < 0) {
            x = first(roles, ColumnRole.Kind.X, y);
        }
        if (y < 0) {
            y = first(roles, ColumnRole.Kind.Y, x);
        }
        if (x == y) {
            throw new ImportException(source, header.line(), names.get(x), "the wavelength and value columns would"
                    + " both be column " + (x + 1) + "; choose both xColumn and yColumn");
        }
        ColumnRole xRole = roles[x];
        if (xRole.isX() && xRole.xUnit() == null && options.xUnit().isEmpty()) {
            throw new ImportException(source, header.line(), names.get(x), "unknown wavelength unit in column '"
                    + names.get(x) + "'; expected nm, µm, Å or cm-1, or set the x unit in the read options");
        }
        ColumnRole yRole = roles[y].isY() ? roles[y] : new ColumnRole(ColumnRole.Kind.Y, null, null, false);
        XUnit unit = xRole.isX() && xRole.xUnit() != null ? xRole.xUnit() : XUnit.NANOMETRE;
        notes.add("columns chosen in the read options: wavelength = column " + (x + 1) + " ('" + names.get(x)
                + "'), values = column " + (y + 1) + " ('" + names.get(y) + "')"
                + (header.names() != null && !xRole.isX() && options.xUnit().isEmpty()
                        ? "; its name gives no unit, so the wavelengths are read in nm" : ""));
        return new DelimitedTextReader.Series(x, y, names.get(x), names.get(y), unit, yRole);
    }

    private static ColumnRole[] roles(List<String> names, boolean fromHeader) {
        ColumnRole[] roles = new ColumnRole[names.size()];
        for (int c = 0; c < roles.length; c++) {
            if (!fromHeader) {
                roles[c] = ColumnRole.OTHER;
                continue;
            }
            try {
                roles[c] = ColumnRole.of(names.get(c));
            } catch (IllegalArgumentException e) {
                // a wavelength column with a unit this reader does not know: the x unit option must say it
                roles[c] = new ColumnRole(ColumnRole.Kind.X, null, null, false);
            }
        }
        return roles;
    }

    /** 0-based index of the chosen column, or −1 when none was chosen; refused beyond the file's columns. */
    private static int chosen(String source, TextTable.Header header, String option, OptionalInt column, int count)
            throws ImportException {
        if (column.isEmpty()) {
            return -1;
        }
        int c = column.getAsInt();
        if (c > count) {
            throw new ImportException(source, header.line(), null, option + " is " + c + " but the file has only "
                    + count + " column" + (count == 1 ? "" : "s"));
        }
        return c - 1;
    }

    /** The first column of the kind, else the first column that is not {@code other}. */
    private static int first(ColumnRole[] roles, ColumnRole.Kind kind, int other) {
        for (int c = 0; c < roles.length; c++) {
            if (c != other && roles[c].kind() == kind) {
                return c;
            }
        }
        for (int c = 0; c < roles.length; c++) {
            if (c != other) {
                return c;
            }
        }
        return other;
    }
}
