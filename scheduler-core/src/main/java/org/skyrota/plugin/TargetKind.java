package org.skyrota.plugin;

import java.util.Map;

/**
 * A kind of target whose position changes with time (a planet, a comet) or is computed in a way of
 * its own. Fixed ICRS targets are built in and need no plugin.
 */
public interface TargetKind extends SkyrotaPlugin {

    /** The kind's name as stored with a request, for example {@code "planet"}; lower case, not null. */
    String kind();

    /** The parameters a request of this kind carries (for example {@code "body"}), with a line each on their meaning. */
    Map<String, String> parameterHelp();

    /**
     * Builds the target a request describes.
     *
     * @param parameters the request's parameters for this kind; not null
     * @return the target; not null
     * @throws PluginException naming the parameter that is missing or wrong
     */
    MovingTarget resolve(Map<String, String> parameters) throws PluginException;
}
