package org.skyrota.planning.model;

/**
 * A course, lab section or club project that is granted telescope time for the term.
 *
 * @param id            stable identifier
 * @param name          display name
 * @param grantedHours  hours granted for the planning horizon
 * @param weight        relative importance in the fairness rule, positive, 1 for an ordinary program: a program of
 *                      weight 2 counts twice when the shares of placed time are held against the grants. It does not
 *                      scale the priority of the program's visits (priority stays each request's own 1 to 5).
 */
public record Program(String id, String name, double grantedHours, double weight) {
    public Program {
        Checks.notBlank("program id", id);
        Checks.notBlank("program name", name);
        Checks.notNegative("grantedHours of program " + id, grantedHours);
        Checks.positive("weight of program " + id, weight);
    }
}
