package org.skyrota.web.request;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.PageView;
import org.springframework.data.domain.Pageable;
import org.springframework.data.domain.Sort;
import org.springframework.jdbc.core.namedparam.MapSqlParameterSource;
import org.springframework.jdbc.core.namedparam.NamedParameterJdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * Pages of the request queue, read with plain SQL into {@link RequestView}s.
 *
 * <p>Listing is the call a term's requesters make most. Building and tracking entities for a page that is only
 * read cost more than the four queries themselves, so this reads the rows straight, on the connection of the
 * caller's transaction (the JPA transaction manager shares it with JDBC). The columns are those of
 * {@link ObservingRequest}'s mapping; the request API tests compare listed requests with the same requests read
 * through the entity, on H2 and on PostgreSQL.
 */
@Component
class RequestListing {

    /** The properties a listing may be sorted by, and their columns. */
    private static final Map<String, String> SORTABLE = Map.ofEntries(
            Map.entry("id", "id"), Map.entry("version", "version"), Map.entry("createdAt", "created_at"),
            Map.entry("updatedAt", "updated_at"), Map.entry("owner", "owner"), Map.entry("targetName", "target_name"),
            Map.entry("targetKind", "target_kind"), Map.entry("raDeg", "ra_deg"), Map.entry("decDeg", "dec_deg"),
            Map.entry("minAltitudeDeg", "min_altitude_deg"), Map.entry("maxAirmass", "max_airmass"),
            Map.entry("darkness", "darkness"),
            Map.entry("earliestNight", "earliest_night"), Map.entry("latestNight", "latest_night"),
            Map.entry("repeats", "repeats"), Map.entry("priority", "priority"), Map.entry("state", "state"),
            Map.entry("program", "program_id"), Map.entry("programId", "program_id"));

    private static final String COLUMNS = "id, version, program_id, owner, target_name, ra_deg, dec_deg, min_altitude_deg,"
            + " darkness, min_moon_separation_deg, max_moon_illumination, max_airmass, earliest_night, latest_night, repeats,"
            + " repeat_interval_hours, repeat_tolerance_hours, priority, state, rejection_reason, created_at, updated_at,"
            + " target_kind, alert_ivorn";

    private final NamedParameterJdbcTemplate jdbc;

    RequestListing(NamedParameterJdbcTemplate jdbc) {
        this.jdbc = jdbc;
    }

    /** One page of the requests that match every non-null member of {@code filter}; the page is always paged. */
    PageView<RequestView> page(RequestService.Filter filter, Pageable pageable) {
        String order = orderBy(pageable.getSort());
        MapSqlParameterSource args = new MapSqlParameterSource();
        String where = where(filter, args);
        long total = jdbc.queryForObject("select count(*) from observing_request" + where, args, Long.class);
        List<RequestView> items = List.of();
        if (pageable.getOffset() < total) {
            String page = " offset " + pageable.getOffset() + " rows fetch next " + pageable.getPageSize() + " rows only";
            items = withPlansAndParameters(jdbc.query("select " + COLUMNS + " from observing_request" + where + order + page,
                    args, RequestListing::view));
        }
        int size = pageable.getPageSize();
        return new PageView<>(items, pageable.getPageNumber(), size, total, (int) ((total + size - 1) / size));
    }

    private static String where(RequestService.Filter filter, MapSqlParameterSource args) {
        List<String> terms = new ArrayList<>();
        if (filter.state() != null) {
            terms.add("state = :state");
            args.addValue("state", filter.state().name());
        }
        if (filter.owner() != null && !filter.owner().isBlank()) {
            terms.add("owner = :owner");
            args.addValue("owner", filter.owner().trim());
        }
        if (filter.programId() != null) {
            terms.add("program_id = :programId");
            args.addValue("programId", filter.programId());
        }
        if (filter.priority() != null) {
            terms.add("priority = :priority");
            args.addValue("priority", filter.priority());
        }
        if (filter.target() != null && !filter.target().isBlank()) {
            terms.add("lower(target_name) like :target");
            args.addValue("target", "%" + filter.target().trim().toLowerCase() + "%");
        }
        return terms.isEmpty() ? "" : " where " + String.join(" and ", terms);
    }

    /** The asked order, then the id, so that pages never share or skip a request when sort keys tie. */
    private static String orderBy(Sort sort) {
        List<String> keys = new ArrayList<>();
        boolean byId = false;
        for (Sort.Order o : sort) {
            String column = SORTABLE.get(o.getProperty());
            if (column == null) {
                throw new InvalidParametersException(List.of(new FieldProblem("sort", "cannot sort by '" + o.getProperty() + "'")));
            }
            byId |= column.equals("id");
            keys.add((o.isIgnoreCase() ? "lower(" + column + ")" : column) + (o.isAscending() ? " asc" : " desc"));
        }
        if (!byId) {
            keys.add("id asc");
        }
        return " order by " + String.join(", ", keys);
    }

    /**
     * Fills in the views' exposure plans and target parameters, two queries for the whole page. The views come from
     * {@link #view} with empty, growable ones.
     */
    private List<RequestView> withPlansAndParameters(List<RequestView> views) {
        if (views.isEmpty()) { // the rows counted were deleted before the page was read
            return views;
        }
        Map<Long, RequestView> byId = new HashMap<>();
        views.forEach(v -> byId.put(v.id(), v));
        MapSqlParameterSource ids = new MapSqlParameterSource("ids", byId.keySet());
        jdbc.query("select request_id, filter_name, seconds, exposure_count from request_exposure"
                + " where request_id in (:ids) order by request_id, seq", ids, rs -> {
            byId.get(rs.getLong(1)).exposures().add(new RequestForm.ExposureForm(rs.getString(2), rs.getDouble(3), rs.getInt(4)));
        });
        jdbc.query("select request_id, param_name, param_value from request_target_parameter"
                + " where request_id in (:ids) order by request_id, param_name", ids, rs -> {
            byId.get(rs.getLong(1)).targetParameters().put(rs.getString(2), rs.getString(3));
        });
        return views;
    }

    private static RequestView view(ResultSet rs, int n) throws SQLException {
        return new RequestView(rs.getLong("id"), rs.getLong("version"), rs.getLong("program_id"), rs.getString("owner"),
                rs.getString("target_name"), rs.getDouble("ra_deg"), rs.getDouble("dec_deg"), new ArrayList<>(),
                rs.getDouble("min_altitude_deg"), DarknessLimit.valueOf(rs.getString("darkness")),
                rs.getObject("min_moon_separation_deg", Double.class), rs.getObject("max_moon_illumination", Double.class),
                rs.getObject("max_airmass", Double.class), rs.getObject("earliest_night", LocalDate.class), rs.getObject("latest_night", LocalDate.class),
                rs.getInt("repeats"), rs.getObject("repeat_interval_hours", Double.class),
                rs.getObject("repeat_tolerance_hours", Double.class), rs.getInt("priority"),
                RequestState.valueOf(rs.getString("state")), rs.getString("rejection_reason"),
                instant(rs, "created_at"), instant(rs, "updated_at"), rs.getString("target_kind"), new LinkedHashMap<>(),
                rs.getString("alert_ivorn"));
    }

    private static Instant instant(ResultSet rs, String column) throws SQLException {
        return rs.getObject(column, OffsetDateTime.class).toInstant();
    }
}
