package org.skyrota.web.site;

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

@RestController
@RequestMapping("/api/sites")
class SiteController {

    private final SiteService service;

    SiteController(SiteService service) {
        this.service = service;
    }

    @GetMapping
    PageView<SiteView> list(@RequestParam(required = false) String name,
                            @PageableDefault(size = 50, sort = "name", direction = Sort.Direction.ASC) Pageable pageable) {
        return service.list(name, pageable);
    }

    @GetMapping("/{id}")
    SiteView get(@PathVariable long id) {
        return service.get(id);
    }

    @PostMapping
    ResponseEntity<SiteView> create(@Valid @RequestBody SiteForm form) {
        SiteView site = service.create(form);
        return ResponseEntity.created(URI.create("/api/sites/" + site.id())).body(site);
    }

    @PutMapping("/{id}")
    SiteView update(@PathVariable long id, @Valid @RequestBody SiteForm form) {
        return service.update(id, form);
    }

    @DeleteMapping("/{id}")
    ResponseEntity<Void> delete(@PathVariable long id, @RequestParam(required = false) Long version) {
        service.delete(id, version);
        return ResponseEntity.noContent().build();
    }
}
