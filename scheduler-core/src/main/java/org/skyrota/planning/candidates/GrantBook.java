package org.skyrota.planning.candidates;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.model.Grant;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.model.Telescope;

/**
 * The grants in force as the score's facts, and which of them pays for a visit on a telescope and night: the most
 * specific grant of the visit's program that covers both (a telescope's before a site's before the network's; among
 * equals the one whose period ends first). Each program also gets one grant of no minutes, which a pin pays from where
 * none of its grants covers the pin's telescope and night, so that the pin shows as over its grant.
 */
final class GrantBook {

    private record Entry(Grant grant, int index) {}

    private final List<ProgramGrant> facts = new ArrayList<>();
    private final Map<String, List<Entry>> byProgram = new HashMap<>();
    private final Map<String, Integer> noGrant = new HashMap<>();
    private final Map<String, Double> share = new HashMap<>();

    GrantBook(List<Grant> grants, Map<String, Program> programs) {
        double total = 0;
        Map<String, Double> hours = new HashMap<>();
        for (Grant g : grants) {
            if (programs.containsKey(g.programId())) {
                total += g.hours();
                hours.merge(g.programId(), g.hours(), Double::sum);
            }
        }
        for (String program : programs.keySet()) {
            share.put(program, total == 0 ? 0 : hours.getOrDefault(program, 0.0) / total);
        }
        for (Grant g : grants) {
            if (!programs.containsKey(g.programId())) {
                continue;
            }
            int index = facts.size();
            facts.add(new ProgramGrant(index, g.programId(), Math.round(g.hours() * 60), share.get(g.programId()), g.label()));
            byProgram.computeIfAbsent(g.programId(), k -> new ArrayList<>()).add(new Entry(g, index));
        }
        // The same order as Grant.payer, so that the planner and the server's ledger agree on who pays.
        Comparator<Entry> order = Comparator.comparing(Entry::grant, Grant.PAYING_ORDER).thenComparingInt(Entry::index);
        byProgram.values().forEach(l -> l.sort(order));
        for (Program p : programs.values()) {
            noGrant.put(p.id(), facts.size());
            facts.add(new ProgramGrant(facts.size(), p.id(), 0, share.get(p.id()),
                    "no grant of program " + p.name() + " for that telescope and night"));
        }
    }

    List<ProgramGrant> facts() {
        return List.copyOf(facts);
    }

    double share(String programId) {
        return share.getOrDefault(programId, 0.0);
    }

    /** The grant that pays for a visit of the program on this telescope and night, or -1 when none does. */
    int pays(String programId, Telescope telescope, LocalDate night) {
        for (Entry e : byProgram.getOrDefault(programId, List.of())) {
            if (e.grant().covers(telescope, night)) {
                return e.index();
            }
        }
        return -1;
    }

    /** The program's grant of no minutes, for a pin that no grant covers. */
    int noGrant(String programId) {
        return noGrant.get(programId);
    }
}
