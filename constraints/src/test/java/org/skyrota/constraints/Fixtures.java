package org.skyrota.constraints;

import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;

import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Visit;

/** Hand-made visits and placements for the verifier tests: two telescopes, lengths in minutes. */
final class Fixtures {
    private static final AtomicInteger NEXT_ID = new AtomicInteger();
    static final int NIGHT = 20_000;

    private Fixtures() {
    }

    static Placement at(int telescope, int startMinute) {
        return new Placement(NEXT_ID.getAndIncrement(), telescope, 0, startMinute, NIGHT);
    }

    static Placement at(int telescope, int startMinute, int nightEpochDay) {
        return new Placement(NEXT_ID.getAndIncrement(), telescope, 0, startMinute, nightEpochDay);
    }

    static VisitBuilder visit(String id) {
        return new VisitBuilder(id);
    }

    static final class VisitBuilder {
        private final String id;
        private String request;
        private String program = "P1";
        private double grantShare = 0.5;
        private double programWeight = 1;
        private int priority = 3;
        private int length = 30;
        private int overhead = 0;
        private int gap = 0;
        private int airmass;
        private int sky;
        private int urgency;
        private byte flags;
        private Placement placement;
        private Placement published;
        private boolean pinned;
        private int grant;

        VisitBuilder(String id) {
            this.id = id;
            this.request = id;
        }

        VisitBuilder request(String r, int minGapMinutes) {
            request = r;
            gap = minGapMinutes;
            return this;
        }

        VisitBuilder program(String p, double share) {
            program = p;
            grantShare = share;
            return this;
        }

        VisitBuilder program(String p, double share, double weight) {
            program = p;
            grantShare = share;
            programWeight = weight;
            return this;
        }

        VisitBuilder priority(int p) {
            priority = p;
            return this;
        }

        VisitBuilder length(int minutes) {
            length = minutes;
            return this;
        }

        VisitBuilder overhead(int minutes) {
            overhead = minutes;
            return this;
        }

        VisitBuilder costs(int airmassCost, int skyCost, int urgencyCost) {
            airmass = airmassCost;
            sky = skyCost;
            urgency = urgencyCost;
            return this;
        }

        VisitBuilder flags(byte f) {
            flags = f;
            return this;
        }

        VisitBuilder at(Placement p) {
            placement = p;
            return this;
        }

        VisitBuilder published(Placement p) {
            published = p;
            return this;
        }

        VisitBuilder pinned() {
            pinned = true;
            return this;
        }

        /** The grant (index into the schedule's grants) its placement pays from; 0 unless given. */
        VisitBuilder grant(int index) {
            grant = index;
            return this;
        }

        Visit build() {
            List<Placement> candidates = placement == null ? List.of() : List.of(placement);
            int n = candidates.size();
            int[] a = new int[n];
            int[] s = new int[n];
            int[] u = new int[n];
            byte[] f = new byte[n];
            if (n == 1) {
                a[0] = airmass;
                s[0] = sky;
                u[0] = urgency;
                f[0] = flags;
            }
            Visit v = new Visit(id, request, 0, program, grantShare, programWeight, priority, priority, length, gap,
                    new int[] {length, length}, new int[] {overhead, overhead}, candidates, a, s, u, f);
            int[] g = new int[n];
            java.util.Arrays.fill(g, grant);
            v.setGrants(g);
            v.setPlacement(placement);
            v.setPublished(published);
            v.setPinned(pinned);
            return v;
        }
    }
}
