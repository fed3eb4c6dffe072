package org.skyrota.web.equipment;

import java.net.URI;

import jakarta.validation.Valid;

import org.skyrota.web.equipment.EquipmentViews.InstrumentView;
import org.skyrota.web.equipment.EquipmentViews.TelescopeView;
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
@RequestMapping("/api")
class EquipmentController {

    private final EquipmentService service;

    EquipmentController(EquipmentService service) {
        this.service = service;
    }

    @GetMapping("/telescopes")
    PageView<TelescopeView> telescopes(@RequestParam(required = false) Long siteId, @PageableDefault(size = 50, sort = "name") Pageable pageable) {
        return service.listTelescopes(siteId, pageable);
    }

    @GetMapping("/telescopes/{id}")
    TelescopeView telescope(@PathVariable long id) {
        return service.getTelescope(id);
    }

    @PostMapping("/telescopes")
    ResponseEntity<TelescopeView> createTelescope(@Valid @RequestBody TelescopeForm form) {
        TelescopeView t = service.createTelescope(form);
        return ResponseEntity.created(URI.create("/api/telescopes/" + t.id())).body(t);
    }

    @PutMapping("/telescopes/{id}")
    TelescopeView updateTelescope(@PathVariable long id, @Valid @RequestBody TelescopeForm form) {
        return service.updateTelescope(id, form);
    }

    @DeleteMapping("/telescopes/{id}")
    ResponseEntity<Void> deleteTelescope(@PathVariable long id, @RequestParam(required = false) Long version) {
        service.deleteTelescope(id, version);
        return ResponseEntity.noContent().build();
    }

    @GetMapping("/instruments")
    PageView<InstrumentView> instruments(@RequestParam(required = false) Long telescopeId, @PageableDefault(size = 50, sort = "name") Pageable pageable) {
        return service.listInstruments(telescopeId, pageable);
    }

    @GetMapping("/instruments/{id}")
    InstrumentView instrument(@PathVariable long id) {
        return service.getInstrument(id);
    }

    @PostMapping("/instruments")
    ResponseEntity<InstrumentView> createInstrument(@Valid @RequestBody InstrumentForm form) {
        InstrumentView i = service.createInstrument(form);
        return ResponseEntity.created(URI.create("/api/instruments/" + i.id())).body(i);
    }

    @PutMapping("/instruments/{id}")
    InstrumentView updateInstrument(@PathVariable long id, @Valid @RequestBody InstrumentForm form) {
        return service.updateInstrument(id, form);
    }

    @DeleteMapping("/instruments/{id}")
    ResponseEntity<Void> deleteInstrument(@PathVariable long id, @RequestParam(required = false) Long version) {
        service.deleteInstrument(id, version);
        return ResponseEntity.noContent().build();
    }
}
