package org.skyrota.plugins.smallbodies;

import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.TargetKind;
import org.skyrota.sky.time.TimeScales;

/**
 * The target kind {@code orbit}: a comet or asteroid from osculating heliocentric elements,
 * mean ecliptic and equinox of J2000, moved by two-body motion (see {@link OrbitTarget} for the
 * accuracy). The orbit's size is {@code q} (perihelion distance) or, for an ellipse, {@code a};
 * its timing is {@code perihelion_time}, or for an ellipse {@code epoch} with {@code mean_anomaly}.
 * Times are TT, as a Julian Date ({@code 2448193.04502}), a date with a fraction of a day
 * ({@code 1990-10-28.54502}) or a date and time ({@code 1990-10-28T13:04:49}).
 */
public final class OrbitKind implements TargetKind {

    public static final String KIND = "orbit";
    static final PluginDescriptor DESCRIPTOR =
            new PluginDescriptor("small-bodies", "Comets and asteroids", "1.0", PluginApi.VERSION);

    private static final Map<String, String> HELP = help();
    private static final Set<String> NAMES = HELP.keySet();

    private static Map<String, String> help() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("name", "optional label, for example the body's designation");
        m.put("q", "perihelion distance, AU (give q or a)");
        m.put("a", "semi-major axis, AU, for an ellipse only (give q or a)");
        m.put("e", "eccentricity: below 1 an ellipse, 1 a parabola, above 1 a hyperbola");
        m.put("i", "inclination to the J2000 ecliptic, degrees, 0 to 180");
        m.put("node", "longitude of the ascending node, J2000, degrees");
        m.put("arg_perihelion", "argument of perihelion, degrees");
        m.put("perihelion_time", "time of perihelion, TT: Julian Date, YYYY-MM-DD.ddddd or YYYY-MM-DDThh:mm:ss");
        m.put("epoch", "instead of perihelion_time, for an ellipse: the epoch of mean_anomaly, TT, same forms");
        m.put("mean_anomaly", "mean anomaly at epoch, degrees (with epoch)");
        return Map.copyOf(m);
    }

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        return "Comets and asteroids from osculating orbital elements (two-body motion: good near the elements' epoch).";
    }

    @Override
    public String kind() {
        return KIND;
    }

    @Override
    public Map<String, String> parameterHelp() {
        return HELP;
    }

    @Override
    public MovingTarget resolve(Map<String, String> p) throws PluginException {
        return resolveOrbit(p);
    }

    /** As {@link #resolve}, typed. */
    public OrbitTarget resolveOrbit(Map<String, String> p) throws PluginException {
        for (String key : p.keySet()) {
            if (!NAMES.contains(key)) {
                throw new PluginException(key, "unknown parameter " + key + " for an orbit; the parameters are " + String.join(", ", NAMES));
            }
        }
        double e = number(p, "e");
        if (e < 0) {
            throw new PluginException("e", "the eccentricity e cannot be negative: " + e);
        }
        boolean hasQ = present(p, "q");
        boolean hasA = present(p, "a");
        if (hasQ == hasA) {
            throw new PluginException(hasQ ? "a" : "q", hasQ ? "give q or a, not both" : "the orbit needs q (perihelion distance) or a (semi-major axis)");
        }
        double q;
        if (hasA) {
            double a = number(p, "a");
            if (e >= 1) {
                throw new PluginException("e", "with a semi-major axis a the orbit must be an ellipse, e below 1, not " + e + "; give q for a parabola or hyperbola");
            }
            if (!(a > 0)) {
                throw new PluginException("a", "the semi-major axis a must be positive: " + a);
            }
            q = a * (1 - e);
        } else {
            q = number(p, "q");
            if (!(q > 0)) {
                throw new PluginException("q", "the perihelion distance q must be positive: " + q);
            }
        }
        double i = number(p, "i");
        if (!(i >= 0 && i <= 180)) {
            throw new PluginException("i", "the inclination i must be from 0 to 180 degrees: " + i);
        }
        double node = number(p, "node");
        double argPeri = number(p, "arg_perihelion");

        double perihelion;
        boolean hasT = present(p, "perihelion_time");
        boolean hasEpoch = present(p, "epoch") || present(p, "mean_anomaly");
        if (hasT && hasEpoch) {
            throw new PluginException("epoch", "give perihelion_time, or epoch with mean_anomaly, not both");
        } else if (hasT) {
            perihelion = julianDateTt(p.get("perihelion_time"), "perihelion_time");
        } else if (hasEpoch) {
            if (e >= 1) {
                throw new PluginException("mean_anomaly", "a mean anomaly only times an ellipse; for e " + e + " give perihelion_time");
            }
            if (!present(p, "epoch")) {
                throw new PluginException("epoch", "mean_anomaly needs the epoch it refers to");
            }
            double epoch = julianDateTt(p.get("epoch"), "epoch");
            double m = Math.toRadians(number(p, "mean_anomaly"));
            double a = q / (1 - e);
            double n = TwoBody.K / (a * Math.sqrt(a));
            perihelion = epoch - Math.IEEEremainder(m, 2 * Math.PI) / n;
        } else {
            throw new PluginException("perihelion_time", "the orbit needs perihelion_time, or epoch with mean_anomaly");
        }
        String name = p.getOrDefault("name", "").strip();
        return new OrbitTarget(name.isEmpty() ? "orbit" : name, q, e, perihelion,
                Math.toRadians(i), Math.toRadians(node), Math.toRadians(argPeri));
    }

    private static boolean present(Map<String, String> p, String key) {
        return p.get(key) != null && !p.get(key).isBlank();
    }

    private static double number(Map<String, String> p, String key) throws PluginException {
        String text = p.get(key);
        if (text == null || text.isBlank()) {
            throw new PluginException(key, key + " is missing (" + HELP.get(key) + ")");
        }
        double x;
        try {
            x = Double.parseDouble(text.strip());
        } catch (NumberFormatException ex) {
            throw new PluginException(key, key + " must be a number: \"" + text + "\"");
        }
        if (!Double.isFinite(x)) {
            throw new PluginException(key, key + " must be a finite number: \"" + text + "\"");
        }
        return x;
    }

    /** A Julian Date, a date with a decimal fraction of a day, or an ISO date and time; all TT. */
    static double julianDateTt(String text, String key) throws PluginException {
        String t = text.strip();
        try {
            double jd = Double.parseDouble(t);
            if (!(jd > 0 && jd < 1e7)) {
                throw new PluginException(key, key + " as a Julian Date must be positive and below 10 000 000: \"" + text + "\"");
            }
            return jd;
        } catch (NumberFormatException notNumber) {
            // a date follows
        }
        try {
            if (t.contains("T")) {
                LocalDateTime dt = LocalDateTime.parse(t.endsWith("Z") ? t.substring(0, t.length() - 1) : t);
                return TimeScales.J2000_JD - 0.5
                        + (dt.toEpochSecond(ZoneOffset.UTC) - LocalDateTime.of(2000, 1, 1, 0, 0).toEpochSecond(ZoneOffset.UTC)) / 86400.0
                        + dt.getNano() / 86400e9;
            }
            int dot = t.indexOf('.', t.lastIndexOf('-'));
            LocalDate date = LocalDate.parse(dot < 0 ? t : t.substring(0, dot));
            double fraction = dot < 0 ? 0 : Double.parseDouble("0" + t.substring(dot));
            return TimeScales.julianDay(date.getYear(), date.getMonthValue(), date.getDayOfMonth() + fraction, false);
        } catch (DateTimeParseException | NumberFormatException ex) {
            throw new PluginException(key, key + " must be a Julian Date, YYYY-MM-DD.ddddd or YYYY-MM-DDThh:mm:ss (TT): \"" + text + "\"");
        }
    }
}
