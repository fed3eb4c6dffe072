package org.skyrota.plugin;

import java.io.IOException;
import java.time.LocalDate;
import java.util.List;

/** A source of expected conditions (closures, cloud cover) that the planner reads before it plans. */
public interface ConditionsFeed extends SkyrotaPlugin {

    /**
     * The conditions known for the nights from {@code from} to {@code to} inclusive.
     *
     * @throws IOException  when the source cannot be read
     * @throws PluginException when the source is malformed, naming the line or field
     */
    List<SiteCondition> conditions(LocalDate from, LocalDate to) throws IOException, PluginException;
}
