package org.skyrota.plugins.voevent;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import javax.xml.parsers.ParserConfigurationException;
import org.skyrota.plugin.PluginException;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;
import org.xml.sax.ErrorHandler;
import org.xml.sax.SAXException;
import org.xml.sax.SAXParseException;

/**
 * Reads a VOEvent 2.0 packet (IVOA Recommendation "Sky Event Reporting Metadata Version 2.0",
 * 2011). The packet's root is {@code VOEvent} in the namespace {@value #NAMESPACE} with
 * unqualified children, as the standard's schema declares them.
 *
 * <p>The JDK's DOM parser is used with DOCTYPE declarations refused and every external entity,
 * DTD and schema access disabled, so a packet cannot make the server read a file or a URL (XXE).
 *
 * <p>Only celestial positions in FK5 (J2000) or ICRS are accepted (the two agree to some tens of
 * milliarcseconds, far below any alert's error circle); the time frame of the coordinate system
 * must be UTC or TT. A TT time is taken as UTC: the two differ by about a minute, and the time only
 * chooses the first night the request may be observed.
 */
public final class VoEventParser {

    public static final String NAMESPACE = "http://www.ivoa.net/xml/VOEvent/v2.0";
    /**
     * The first and the last moment of the years an event time may lie in: those the server plans in (its nights run
     * from 1900-01-01 to 2200-12-31). A time outside them is a mistake in the packet, not an event to observe.
     */
    public static final Instant EARLIEST_EVENT = Instant.parse("1900-01-01T00:00:00Z");
    public static final Instant LATEST_EVENT = Instant.parse("2200-12-31T23:59:59.999999999Z");
    /** Alerts are small; a larger packet is refused before it is parsed. */
    public static final int MAX_BYTES = 1024 * 1024;

    private final boolean allowTestPackets;

    /** @param allowTestPackets whether packets with {@code role="test"} are accepted (for trying a feed out) */
    public VoEventParser(boolean allowTestPackets) {
        this.allowTestPackets = allowTestPackets;
    }

    /**
     * Parses one packet.
     *
     * @throws PluginException with the reason the packet is refused; {@link PluginException#field()} names the element or attribute
     * @throws IOException     when the stream fails
     */
    public VoEventAlert parse(InputStream in) throws PluginException, IOException {
        byte[] bytes = in.readNBytes(MAX_BYTES + 1);
        if (bytes.length > MAX_BYTES) {
            throw new PluginException(null, "the packet is larger than " + MAX_BYTES + " bytes");
        }
        Document doc = parseXml(bytes);
        Element root = doc.getDocumentElement();
        if (!"VOEvent".equals(root.getLocalName())) {
            throw new PluginException("VOEvent", "the root element is <" + root.getTagName() + ">, not <VOEvent>");
        }
        if (!NAMESPACE.equals(root.getNamespaceURI())) {
            throw new PluginException("VOEvent", "the root element is not in the VOEvent 2.0 namespace " + NAMESPACE
                    + " (found " + (root.getNamespaceURI() == null ? "no namespace" : root.getNamespaceURI()) + ")");
        }
        String version = root.getAttribute("version");
        if (!version.isEmpty() && !"2.0".equals(version)) {
            throw new PluginException("version", "only VOEvent version 2.0 is read, not " + version);
        }
        String ivorn = root.getAttribute("ivorn").strip();
        if (!ivorn.startsWith("ivo://") || ivorn.length() <= "ivo://".length()) {
            throw new PluginException("ivorn", "the ivorn attribute must be an IVOA identifier starting with ivo://: \"" + ivorn + "\"");
        }
        String role = root.getAttribute("role").strip();
        role = role.isEmpty() ? "observation" : role; // the schema's default
        switch (role) {
            case "observation", "prediction" -> { }
            case "test" -> {
                if (!allowTestPackets) {
                    throw new PluginException("role", "the packet is a test (role=\"test\") and test packets are not accepted");
                }
            }
            case "utility" -> throw new PluginException("role", "a utility packet reports no event to observe");
            default -> throw new PluginException("role", "role must be observation, prediction, utility or test: \"" + role + "\"");
        }

        Element who = child(root, "Who");
        Instant authoredAt = null;
        if (who != null && child(who, "Date") != null) {
            authoredAt = instant(text(child(who, "Date")), "Who/Date");
        }

        Element whereWhen = required(root, "WhereWhen", "WhereWhen");
        Element location = required(required(whereWhen, "ObsDataLocation", "WhereWhen/ObsDataLocation"),
                "ObservationLocation", "WhereWhen/ObsDataLocation/ObservationLocation");
        Element coords = required(location, "AstroCoords", "ObservationLocation/AstroCoords");
        String system = coords.getAttribute("coord_system_id").strip();
        if (system.isEmpty()) {
            Element declared = child(location, "AstroCoordSystem");
            system = declared == null ? "" : declared.getAttribute("id").strip();
        }
        checkSystem(system);

        Element time = required(coords, "Time", "AstroCoords/Time");
        Element isoTime = required(required(time, "TimeInstant", "AstroCoords/Time/TimeInstant"), "ISOTime",
                "AstroCoords/Time/TimeInstant/ISOTime");
        Instant eventTime = instant(text(isoTime), "ISOTime");
        if (eventTime.isBefore(EARLIEST_EVENT) || eventTime.isAfter(LATEST_EVENT)) {
            throw new PluginException("ISOTime", "the event time (ISOTime) must lie from 1900-01-01 to 2200-12-31, UTC: \""
                    + text(isoTime) + "\"");
        }

        Element position = child(coords, "Position2D");
        if (position == null) {
            throw new PluginException("Position2D", "the packet gives no sky position (AstroCoords/Position2D)");
        }
        String unit = position.getAttribute("unit").strip();
        if (!unit.isEmpty() && !"deg".equals(unit)) {
            throw new PluginException("Position2D", "Position2D must be in degrees (unit=\"deg\"), not \"" + unit + "\"");
        }
        Element value2 = required(position, "Value2", "Position2D/Value2");
        double c1 = number(required(value2, "C1", "Position2D/Value2/C1"), "C1");
        double c2 = number(required(value2, "C2", "Position2D/Value2/C2"), "C2");
        if (!(c1 >= 0 && c1 <= 360)) {
            throw new PluginException("C1", "the right ascension (C1) must be from 0 to 360 degrees: " + c1);
        }
        if (!(c2 >= -90 && c2 <= 90)) {
            throw new PluginException("C2", "the declination (C2) must be from -90 to +90 degrees: " + c2);
        }
        double raDeg = c1 == 360 ? 0 : c1;
        Double errorRadius = null;
        Element error = child(position, "Error2Radius");
        if (error != null) {
            errorRadius = number(error, "Error2Radius");
            if (!(errorRadius >= 0 && errorRadius <= 180)) {
                throw new PluginException("Error2Radius", "the error radius must be from 0 to 180 degrees: " + errorRadius);
            }
        }

        Double importance = null;
        String name = null;
        Element why = child(root, "Why");
        if (why != null) {
            String attr = why.getAttribute("importance").strip();
            if (!attr.isEmpty()) {
                try {
                    importance = Double.parseDouble(attr);
                } catch (NumberFormatException e) {
                    throw new PluginException("importance", "Why/@importance must be a number from 0 to 1: \"" + attr + "\"");
                }
                if (!(importance >= 0 && importance <= 1)) {
                    throw new PluginException("importance", "Why/@importance must be from 0 to 1: " + attr);
                }
            }
            name = firstName(why);
        }
        if (name == null) {
            int hash = ivorn.indexOf('#');
            name = hash >= 0 && hash + 1 < ivorn.length() ? ivorn.substring(hash + 1) : ivorn;
        }
        return new VoEventAlert(ivorn, role, authoredAt, eventTime, raDeg, c2, errorRadius, system, importance, name);
    }

    /** Convenience for text already in memory. */
    public VoEventAlert parse(byte[] packet) throws PluginException {
        try {
            return parse(new ByteArrayInputStream(packet));
        } catch (IOException e) {
            throw new IllegalStateException("a byte array cannot fail to read", e);
        }
    }

    private static Document parseXml(byte[] bytes) throws PluginException, IOException {
        DocumentBuilder builder;
        try {
            DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
            factory.setNamespaceAware(true);
            factory.setFeature(XMLConstants.FEATURE_SECURE_PROCESSING, true);
            factory.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
            factory.setFeature("http://xml.org/sax/features/external-general-entities", false);
            factory.setFeature("http://xml.org/sax/features/external-parameter-entities", false);
            factory.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
            factory.setAttribute(XMLConstants.ACCESS_EXTERNAL_DTD, "");
            factory.setAttribute(XMLConstants.ACCESS_EXTERNAL_SCHEMA, "");
            factory.setXIncludeAware(false);
            factory.setExpandEntityReferences(false);
            builder = factory.newDocumentBuilder();
        } catch (ParserConfigurationException | IllegalArgumentException e) {
            throw new IllegalStateException("the JDK's XML parser cannot be made safe against external entities", e);
        }
        builder.setErrorHandler(new ErrorHandler() {
            @Override
            public void warning(SAXParseException e) {
            }

            @Override
            public void error(SAXParseException e) throws SAXException {
                throw e;
            }

            @Override
            public void fatalError(SAXParseException e) throws SAXException {
                throw e;
            }
        });
        builder.setEntityResolver((publicId, systemId) -> {
            throw new SAXException("external entities are not read: " + systemId);
        });
        try {
            return builder.parse(new ByteArrayInputStream(bytes));
        } catch (SAXParseException e) {
            String reason = e.getMessage() != null && e.getMessage().contains("DOCTYPE")
                    ? "DOCTYPE declarations are not accepted in a VOEvent packet" : e.getMessage();
            throw new PluginException("line " + e.getLineNumber(), "the packet is not well-formed XML (line "
                    + e.getLineNumber() + ", column " + e.getColumnNumber() + "): " + reason, e);
        } catch (SAXException e) {
            throw new PluginException(null, "the packet is not well-formed XML: " + e.getMessage(), e);
        }
    }

    private static void checkSystem(String system) throws PluginException {
        if (system.isEmpty()) {
            throw new PluginException("coord_system_id", "AstroCoords has no coord_system_id and no AstroCoordSystem is declared");
        }
        String[] parts = system.toUpperCase(Locale.ROOT).split("-");
        if (parts.length < 2) {
            throw new PluginException("coord_system_id", "the coordinate system must look like UTC-ICRS-GEO: \"" + system + "\"");
        }
        if (!parts[0].equals("UTC") && !parts[0].equals("TT")) {
            throw new PluginException("coord_system_id", "the time frame must be UTC or TT: \"" + system + "\"");
        }
        if (!parts[1].equals("ICRS") && !parts[1].equals("FK5")) {
            throw new PluginException("coord_system_id", "only ICRS or FK5 (J2000) positions are accepted: \"" + system + "\"");
        }
    }

    private static Instant instant(String text, String field) throws PluginException {
        try {
            return OffsetDateTime.parse(text).toInstant();
        } catch (DateTimeParseException e) {
            try {
                // VOEvent times carry no zone: the coordinate system names the time frame.
                return LocalDateTime.parse(text).toInstant(ZoneOffset.UTC);
            } catch (DateTimeParseException e2) {
                throw new PluginException(field, field + " must be an ISO 8601 time such as 2027-03-01T02:03:04.5: \"" + text + "\"");
            }
        }
    }

    private static double number(Element e, String field) throws PluginException {
        String text = text(e);
        try {
            double x = Double.parseDouble(text);
            if (!Double.isFinite(x)) {
                throw new NumberFormatException();
            }
            return x;
        } catch (NumberFormatException ex) {
            throw new PluginException(field, field + " must be a finite number: \"" + text + "\"");
        }
    }

    private static String firstName(Element why) {
        for (Element inference : children(why, "Inference")) {
            Element name = child(inference, "Name");
            if (name != null && !text(name).isEmpty()) {
                return text(name);
            }
        }
        Element name = child(why, "Name");
        return name != null && !text(name).isEmpty() ? text(name) : null;
    }

    private static Element required(Element parent, String name, String path) throws PluginException {
        Element e = child(parent, name);
        if (e == null) {
            throw new PluginException(name, "the packet lacks " + path);
        }
        return e;
    }

    private static Element child(Element parent, String localName) {
        for (Node n = parent.getFirstChild(); n != null; n = n.getNextSibling()) {
            if (n instanceof Element e && localName.equals(e.getLocalName())) {
                return e;
            }
        }
        return null;
    }

    private static List<Element> children(Element parent, String localName) {
        List<Element> found = new ArrayList<>();
        for (Node n = parent.getFirstChild(); n != null; n = n.getNextSibling()) {
            if (n instanceof Element e && localName.equals(e.getLocalName())) {
                found.add(e);
            }
        }
        return found;
    }

    private static String text(Element e) {
        return e.getTextContent() == null ? "" : e.getTextContent().strip();
    }
}
