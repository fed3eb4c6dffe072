package org.skyrota.planning.domain;

import java.util.Comparator;

/** Harder visits first in the construction heuristic: more priority-weighted time, then fewer candidates. */
public final class VisitDifficulty implements Comparator<Visit> {
    @Override
    public int compare(Visit a, Visit b) {
        int byValue = Long.compare(a.priorityWeight() * a.nominalMinutes(), b.priorityWeight() * b.nominalMinutes());
        if (byValue != 0) {
            return byValue;
        }
        int byChoice = Integer.compare(b.candidateCount(), a.candidateCount());
        return byChoice != 0 ? byChoice : a.id().compareTo(b.id());
    }
}
