package org.skyrota.web.report;

import java.time.Instant;

import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

@RestController
class ReportController {

    private final ReportService service;

    ReportController(ReportService service) {
        this.service = service;
    }

    record ReportForm(String visitId, String outcome, String reason, Instant observedAt) {}

    @PostMapping("/api/reports")
    @ResponseStatus(HttpStatus.CREATED)
    ReportService.ReportView report(@RequestBody ReportForm form) {
        return service.report(form.visitId(), form.outcome(), form.reason(), form.observedAt());
    }
}
