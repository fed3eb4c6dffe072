package org.skyrota.web.system;

import java.time.Clock;

import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;

import tools.jackson.databind.json.JsonMapper;

/**
 * Records every change to stored data in the same transaction as the change, so that a change
 * and its record are kept or lost together. Snapshots are the API views of the object, as JSON.
 */
@Service
public class AuditLog {

    private final AuditEventRepository events;
    private final JsonMapper json;

    private final Clock clock;

    AuditLog(AuditEventRepository events, JsonMapper json, Clock clock) {
        this.clock = clock;
        this.events = events;
        this.json = json;
    }

    /**
     * @param before the object as it was, or null when it was created
     * @param after the object as it is now, or null when it was deleted
     */
    @Transactional(propagation = Propagation.MANDATORY)
    public void record(String action, String entityType, long entityId, Object before, Object after) {
        events.save(new AuditEvent(clock.instant(), actor(), action, entityType, entityId,
                before == null ? null : json.writeValueAsString(before),
                after == null ? null : json.writeValueAsString(after)));
    }

    private static String actor() {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        return auth == null || auth.getName() == null ? "system" : auth.getName();
    }
}
