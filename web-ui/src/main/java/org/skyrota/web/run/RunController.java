package org.skyrota.web.run;

import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.servlet.mvc.method.annotation.SseEmitter;

@RestController
@RequestMapping("/api/planner/runs")
class RunController {

    private final RunService service;

    RunController(RunService service) {
        this.service = service;
    }

    @PostMapping
    @ResponseStatus(HttpStatus.ACCEPTED)
    RunView start(@RequestBody RunForm form) {
        return service.start(form);
    }

    @GetMapping("/{id}")
    RunView get(@PathVariable long id) {
        return service.get(id);
    }

    @GetMapping(path = "/{id}/events", produces = MediaType.TEXT_EVENT_STREAM_VALUE)
    SseEmitter events(@PathVariable long id) {
        return service.events(id);
    }

    @DeleteMapping("/{id}")
    RunView cancel(@PathVariable long id) {
        return service.cancel(id);
    }
}
