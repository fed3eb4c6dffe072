package org.skyrota.web.request;

import java.io.IOException;
import java.io.InputStream;
import java.net.URI;
import java.util.List;
import java.util.Map;

import org.skyrota.plugin.RequestImporter;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.InvalidMediaTypeException;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.HttpMediaTypeNotSupportedException;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RestController;

/**
 * Files of requests read by the request-importer plugins ({@code POST /api/requests/import}, the file's media type in
 * {@code Content-Type}), and VOEvent alerts ({@code POST /api/alerts}).
 */
@RestController
class ImportController {

    private final RequestImports imports;
    private final Alerts alerts;

    ImportController(RequestImports imports, Alerts alerts) {
        this.imports = imports;
        this.alerts = alerts;
    }

    @PostMapping("/api/requests/import")
    ResponseEntity<Map<String, Object>> importRequests(
            @RequestHeader(value = HttpHeaders.CONTENT_TYPE, required = false) String contentType, InputStream body)
            throws IOException, HttpMediaTypeNotSupportedException {
        RequestImporter importer = imports.importer(baseType(contentType)).orElseThrow(() ->
                new HttpMediaTypeNotSupportedException(contentType == null ? null : safeType(contentType),
                        imports.mediaTypes().stream().map(MediaType::parseMediaType).toList()));
        List<RequestView> stored = imports.importAll(importer, body);
        return ResponseEntity.status(HttpStatus.CREATED).body(Map.of("imported", stored.size(), "requests", stored));
    }

    /** 201 with the new request, or 200 with the one an earlier packet with the same IVORN made. */
    @PostMapping("/api/alerts")
    ResponseEntity<Alerts.Outcome> alert(InputStream body) throws IOException {
        Alerts.Received received = alerts.receive(body);
        Alerts.Outcome outcome = received.outcome();
        return received.created()
                ? ResponseEntity.created(URI.create("/api/requests/" + outcome.request().id())).body(outcome)
                : ResponseEntity.ok(outcome);
    }

    /** "text/csv; charset=UTF-8" is "text/csv". */
    private static String baseType(String contentType) {
        if (contentType == null) {
            return "";
        }
        int semicolon = contentType.indexOf(';');
        return (semicolon < 0 ? contentType : contentType.substring(0, semicolon)).trim();
    }

    private static MediaType safeType(String contentType) {
        try {
            return MediaType.parseMediaType(contentType);
        } catch (InvalidMediaTypeException e) {
            return null;
        }
    }
}
