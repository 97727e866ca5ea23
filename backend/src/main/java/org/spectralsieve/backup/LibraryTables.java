package org.spectralsieve.backup;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.jooq.ForeignKey;
import org.jooq.Schema;
import org.jooq.Table;
import org.jooq.TableField;
import org.spectralsieve.library.db.DefaultSchema;

/**
 * The tables an archive holds, read from the jOOQ classes generated from the migrations rather than listed
 * by hand: a column or table a later migration adds is backed up and restored without touching this code.
 * Parents come before the tables that reference them, so rows can be inserted in the archive's order.
 *
 * <p>Left out: Flyway's history (the generated schema already excludes it; the target database has its own)
 * and {@link #BOOKKEEPING} tables, which record a process's state rather than library content.
 */
final class LibraryTables {

    /**
     * Tables a migration fills itself and whose rows are coordination state, not library content: the change
     * counter other processes compare their in-memory copies against. A restore raises it instead of copying
     * it, so every running process notices the restored library. The database's identity and the change log
     * (V9) belong to the database, not to its content: a restored library gets an identity of its own, and the
     * restore's raise has no log row, so every index on disk is rebuilt (docs/index-on-disk.md).
     */
    static final Set<String> BOOKKEEPING = Set.of("library_generation", "library_identity", "library_change");

    /**
     * Server mode's accounts and API tokens (V11). An archive carries them (a password's bcrypt hash and a token's
     * SHA-256, never a password or a token), so that a library moved to another database keeps who may use it. A
     * restore into a server that already has accounts keeps that server's own and leaves the archive's out
     * ({@link LibraryRestore}; docs/backup.md).
     */
    static final Set<String> SERVER_ACCOUNTS = Set.of("account", "api_token");

    /** Requirement presets (V14): library content; a private one's owner is an account (see LibraryRestore). */
    static final String PRESETS = "requirement_preset";

    /** The audit trail (V12): library content, appended after a target's own entries about its accounts. */
    static final String AUDIT = "audit_entry";

    private LibraryTables() {
    }

    /** The library's tables, parents first, from the generated schema. */
    static List<Table<?>> inDependencyOrder() {
        return inDependencyOrder(DefaultSchema.DEFAULT_SCHEMA);
    }

    static List<Table<?>> inDependencyOrder(Schema schema) {
        Map<String, Table<?>> remaining = new LinkedHashMap<>();
        schema.getTables().stream()
                .filter(t -> !BOOKKEEPING.contains(name(t)))
                .sorted(Comparator.comparing(LibraryTables::name))
                .forEach(t -> remaining.put(name(t), t));
        List<Table<?>> ordered = new ArrayList<>();
        while (!remaining.isEmpty()) {
            Table<?> next = remaining.values().stream()
                    .filter(t -> parents(t).stream().noneMatch(p -> !p.equals(name(t)) && remaining.containsKey(p)))
                    .findFirst()
                    .orElseThrow(() -> new IllegalStateException("the tables " + remaining.keySet()
                            + " reference each other in a cycle; an archive cannot order their rows"));
            ordered.add(next);
            remaining.remove(name(next));
        }
        return List.copyOf(ordered);
    }

    /** A bookkeeping table of the schema, when this schema version has it. */
    static Optional<Table<?>> bookkeeping(String name) {
        return DefaultSchema.DEFAULT_SCHEMA.getTables().stream().filter(t -> name(t).equals(name)).findFirst();
    }

    /** The names of the tables a table references (a table referencing itself is ordered by key instead). */
    private static List<String> parents(Table<?> table) {
        return table.getReferences().stream().map(ForeignKey::getKey).map(k -> name(k.getTable())).toList();
    }

    /** Lower case, as the archive writes it: H2 folds unquoted names to upper case, PostgreSQL to lower. */
    static String name(Table<?> table) {
        return table.getName().toLowerCase(Locale.ROOT);
    }

    static String name(org.jooq.Field<?> field) {
        return field.getName().toLowerCase(Locale.ROOT);
    }

    /** The primary key's columns, by which rows are paged and ordered (so a self-reference meets its parent first). */
    static List<TableField<?, ?>> primaryKey(Table<?> table) {
        if (table.getPrimaryKey() == null) {
            throw new IllegalStateException("table " + name(table) + " has no primary key; an archive pages rows by it");
        }
        return List.copyOf(table.getPrimaryKey().getFields());
    }
}
