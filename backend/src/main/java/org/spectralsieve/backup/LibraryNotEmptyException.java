package org.spectralsieve.backup;

import java.util.Map;
import java.util.stream.Collectors;

/**
 * A restore was asked into a library that already holds rows. A restore never merges: ids in the archive
 * would collide with the ones there, and a half-merged library is worse than either.
 */
public class LibraryNotEmptyException extends RuntimeException {

    private final Map<String, Long> rowsByTable;

    public LibraryNotEmptyException(Map<String, Long> rowsByTable) {
        super("the library is not empty (" + rowsByTable.entrySet().stream().map(e -> e.getValue() + " " + e.getKey()
                + " rows").collect(Collectors.joining(", ")) + "); a restore goes only into an empty library");
        this.rowsByTable = Map.copyOf(rowsByTable);
    }

    public Map<String, Long> rowsByTable() {
        return rowsByTable;
    }
}
