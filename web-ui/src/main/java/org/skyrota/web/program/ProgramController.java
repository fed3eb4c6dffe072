package org.skyrota.web.program;

import java.net.URI;

import jakarta.validation.Valid;

import org.skyrota.web.system.PageView;
import org.springframework.data.domain.Pageable;
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

@RestController
@RequestMapping("/api/programs")
class ProgramController {

    private final ProgramService service;

    ProgramController(ProgramService service) {
        this.service = service;
    }

    @GetMapping
    PageView<ProgramView> list(@RequestParam(required = false) Boolean active, @PageableDefault(size = 50, sort = "code") Pageable pageable) {
        return service.list(active, pageable);
    }

    @GetMapping("/{id}")
    ProgramView get(@PathVariable long id) {
        return service.get(id);
    }

    @PostMapping
    ResponseEntity<ProgramView> create(@Valid @RequestBody ProgramForm form) {
        ProgramView p = service.create(form);
        return ResponseEntity.created(URI.create("/api/programs/" + p.id())).body(p);
    }

    @PutMapping("/{id}")
    ProgramView update(@PathVariable long id, @Valid @RequestBody ProgramForm form) {
        return service.update(id, form);
    }

    @DeleteMapping("/{id}")
    ResponseEntity<Void> delete(@PathVariable long id, @RequestParam(required = false) Long version) {
        service.delete(id, version);
        return ResponseEntity.noContent().build();
    }
}
