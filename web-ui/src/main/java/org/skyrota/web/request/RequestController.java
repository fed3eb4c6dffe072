package org.skyrota.web.request;

import java.net.URI;

import jakarta.validation.Valid;

import org.skyrota.web.system.PageView;
import org.springframework.data.domain.Pageable;
import org.springframework.data.domain.Sort;
import org.springframework.data.web.PageableDefault;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * Observing requests: CRUD, and the state changes as actions
 * ({@code POST /api/requests/{id}/submit|accept|reject|withdraw|reopen?version=n}).
 */
@RestController
@RequestMapping("/api/requests")
class RequestController {

    private final RequestService service;

    RequestController(RequestService service) {
        this.service = service;
    }

    record Reason(String reason) {}

    @GetMapping
    PageView<RequestView> list(@RequestParam(required = false) RequestState state,
                               @RequestParam(required = false) String owner,
                               @RequestParam(required = false) Long programId,
                               @RequestParam(required = false) String target,
                               @RequestParam(required = false) Integer priority,
                               @PageableDefault(size = 50, sort = "createdAt", direction = Sort.Direction.DESC) Pageable pageable) {
        return service.list(new RequestService.Filter(state, owner, programId, target, priority), pageable);
    }

    @GetMapping("/{id}")
    RequestView get(@PathVariable long id) {
        return service.get(id);
    }

    @PostMapping
    ResponseEntity<RequestView> create(@Valid @RequestBody RequestForm form) {
        RequestView r = service.create(form);
        return ResponseEntity.created(URI.create("/api/requests/" + r.id())).body(r);
    }

    @PutMapping("/{id}")
    RequestView update(@PathVariable long id, @Valid @RequestBody RequestForm form) {
        return service.update(id, form);
    }

    @DeleteMapping("/{id}")
    ResponseEntity<Void> delete(@PathVariable long id, @RequestParam(required = false) Long version) {
        service.delete(id, version);
        return ResponseEntity.noContent().build();
    }

    @PostMapping("/{id}/submit")
    RequestView submit(@PathVariable long id, @RequestParam Long version) {
        return service.move(id, version, RequestState.SUBMITTED, null);
    }

    @PostMapping("/{id}/accept")
    RequestView accept(@PathVariable long id, @RequestParam Long version) {
        return service.move(id, version, RequestState.ACCEPTED, null);
    }

    @PostMapping("/{id}/reject")
    RequestView reject(@PathVariable long id, @RequestParam Long version, @RequestBody(required = false) Reason body) {
        return service.move(id, version, RequestState.REJECTED, body == null ? null : body.reason());
    }

    @PostMapping("/{id}/withdraw")
    RequestView withdraw(@PathVariable long id, @RequestParam Long version) {
        return service.move(id, version, RequestState.WITHDRAWN, null);
    }

    @PostMapping("/{id}/reopen")
    RequestView reopen(@PathVariable long id, @RequestParam Long version) {
        return service.move(id, version, RequestState.DRAFT, null);
    }
}
