/**
 * Requirement presets: named requirement texts for common jobs (docs/presets.md).
 *
 * <p>Three kinds, told apart by their origin: the built-in {@link PresetCatalogue} (a resource versioned with the
 * code, read-only, never rows in the database, so backups and restores leave it alone); presets shared with everyone
 * (owner NULL; curated by admins in server mode); and an account's own. Stored presets live in table
 * {@code requirement_preset} (migration V14) behind {@link PresetStore}: deleting retires, ids are never reused, every
 * change writes an audit entry in its own transaction. {@link PresetFile} is the small export/import format.
 */
package org.spectralsieve.presets;
