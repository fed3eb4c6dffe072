package org.skyrota.planning.model;

/**
 * A course, lab section or club project that is granted telescope time for the term.
 *
 * @param id            stable identifier
 * @param name          display name
 * @param grantedHours  hours granted for the planning horizon
 * @param weight        relative importance, positive
 */
public record Program(String id, String name, double grantedHours, double weight) {
    public Program {
        Checks.notBlank("program id", id);
        Checks.notBlank("program name", name);
        Checks.notNegative("grantedHours of program " + id, grantedHours);
        Checks.positive("weight of program " + id, weight);
    }
}
