package org.skyrota.planning.solver;

import java.util.List;

/**
 * One broken hard rule match: the rule, the visits it names (the planner's visit ids; empty for a match on a grant
 * as a whole), its hard penalty (negative), and for a grant's match the program and the grant's label (else null).
 */
public record Violation(String rule, List<String> visitIds, long hardScore, String programId, String grant) {
    public Violation {
        visitIds = List.copyOf(visitIds);
    }
}
