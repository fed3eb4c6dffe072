package org.skyrota.plugin;

/**
 * Why one row or element of an imported file was refused.
 *
 * @param line    1-based line (or record) number in the file
 * @param field   the column or element at fault, or null for the whole row
 * @param message what is wrong, in plain words
 */
public record ImportProblem(int line, String field, String message) {
}
