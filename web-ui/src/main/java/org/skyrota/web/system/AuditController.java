package org.skyrota.web.system;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

import jakarta.persistence.criteria.Predicate;

import org.springframework.data.domain.Pageable;
import org.springframework.data.domain.Sort;
import org.springframework.data.jpa.domain.Specification;
import org.springframework.data.web.PageableDefault;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The audit log for coordinators and admins: {@code GET /api/audit?entityType=&entityId=&actor=}. */
@RestController
class AuditController {

    private final AuditEventRepository events;
    private final JsonMapper json;

    AuditController(AuditEventRepository events, JsonMapper json) {
        this.events = events;
        this.json = json;
    }

    record AuditView(long id, Instant at, String actor, String action, String entityType, long entityId, JsonNode before, JsonNode after) {}

    @GetMapping("/api/audit")
    @Transactional(readOnly = true)
    PageView<AuditView> list(@RequestParam(required = false) String entityType,
                             @RequestParam(required = false) Long entityId,
                             @RequestParam(required = false) String actor,
                             @PageableDefault(size = 50, sort = "id", direction = Sort.Direction.DESC) Pageable pageable) {
        Specification<AuditEvent> spec = (root, query, cb) -> {
            List<Predicate> where = new ArrayList<>();
            if (entityType != null && !entityType.isBlank()) {
                where.add(cb.equal(root.get("entityType"), entityType.trim()));
            }
            if (entityId != null) {
                where.add(cb.equal(root.get("entityId"), entityId));
            }
            if (actor != null && !actor.isBlank()) {
                where.add(cb.equal(root.get("actor"), actor.trim()));
            }
            return cb.and(where.toArray(Predicate[]::new));
        };
        return PageView.of(events.findAll(spec, pageable), e -> new AuditView(e.getId(), e.getAt(), e.getActor(), e.getAction(),
                e.getEntityType(), e.getEntityId(), parse(e.getBeforeJson()), parse(e.getAfterJson())));
    }

    private JsonNode parse(String text) {
        return text == null ? null : json.readTree(text);
    }
}
