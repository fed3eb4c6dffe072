package org.skyrota.web.plan;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.skyrota.plugin.ConditionsFeed;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.SiteCondition;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The nights the conditions-feed plugins close, as closed telescope nights for a planner run: a closed site or
 * telescope, or a cloud fraction at or above {@code skyrota.conditions.close-at-cloud-fraction} (default 0.9).
 * A feed that cannot be read, or a site it names that is not stored, is reported in the notes and planning goes on
 * without it: a stale forecast must not stop the plan.
 */
@Component
public class ConditionsClosures {

    private static final Logger log = LoggerFactory.getLogger(ConditionsClosures.class);

    private final PluginRegistry plugins;
    private final TelescopeRepository telescopes;
    private final double closeAtCloudFraction;

    ConditionsClosures(PluginRegistry plugins, TelescopeRepository telescopes,
                       @Value("${skyrota.conditions.close-at-cloud-fraction:0.9}") double closeAtCloudFraction) {
        this.plugins = plugins;
        this.telescopes = telescopes;
        this.closeAtCloudFraction = closeAtCloudFraction;
    }

    /** @param nights the closed telescope nights, one per telescope and night; notes what could not be used */
    public record Closures(List<PlanNight> nights, List<String> notes) {}

    public Closures between(LocalDate first, LocalDate last) {
        List<ConditionsFeed> feeds = plugins.plugins(ConditionsFeed.class);
        if (feeds.isEmpty()) {
            return new Closures(List.of(), List.of());
        }
        List<Telescope> all = telescopes.findAll();
        Map<String, PlanNight> closed = new LinkedHashMap<>();
        List<String> notes = new ArrayList<>();
        for (ConditionsFeed feed : feeds) {
            String id = feed.descriptor().id();
            List<SiteCondition> conditions;
            try {
                conditions = feed.conditions(first, last);
            } catch (IOException | PluginException | RuntimeException e) {
                log.warn("Conditions feed {} could not be read; planning without it", id, e);
                notes.add("conditions feed " + id + " could not be read: " + e.getMessage());
                continue;
            }
            for (SiteCondition c : conditions) {
                boolean cloudy = c.cloudFraction() != null && c.cloudFraction() >= closeAtCloudFraction;
                if (!c.closed() && !cloudy) {
                    continue;
                }
                List<Telescope> affected = all.stream()
                        .filter(t -> same(t.getSite().getName(), c.site()))
                        .filter(t -> c.telescope() == null || c.telescope().isBlank() || same(t.getName(), c.telescope()))
                        .toList();
                if (affected.isEmpty()) {
                    notes.add("conditions feed " + id + " names no stored " + (c.telescope() == null || c.telescope().isBlank()
                            ? "site " + c.site() : "telescope " + c.telescope() + " at " + c.site()) + " (night " + c.night() + ")");
                    continue;
                }
                String why = "conditions feed " + id + ": " + (c.reason().isBlank()
                        ? (c.closed() ? "closed" : String.format(Locale.ROOT, "cloud cover %.0f %%", c.cloudFraction() * 100))
                        : c.reason());
                String reason = why.length() > 500 ? why.substring(0, 500) : why;
                for (Telescope t : affected) {
                    closed.putIfAbsent(t.getId() + "@" + c.night(), new PlanNight(t.getId(), c.night(), PlanNight.State.CLOSED, reason));
                }
            }
        }
        return new Closures(List.copyOf(closed.values()), List.copyOf(notes));
    }

    private static boolean same(String a, String b) {
        return a != null && b != null && a.trim().equalsIgnoreCase(b.trim());
    }
}
