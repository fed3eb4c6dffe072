package org.skyrota.web.request;

import java.io.IOException;
import java.io.InputStream;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import jakarta.validation.ConstraintViolation;
import jakarta.validation.Validator;

import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.RequestImporter;
import org.skyrota.plugin.RequestRecord;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.SupportedDates;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Requests read from a file by a request-importer plugin, stored all together or not at all: every problem, the
 * importer's (by line) and the server's (by record), is reported in one answer.
 */
@Service
public class RequestImports {

    /**
     * The nights an imported request may name: those the server plans in. Dates far outside them are mistakes, and
     * years before 1 do not come back from storage as they went in (a request's last night came back before its
     * first, and every planner run after it failed).
     */
    static final LocalDate FIRST_NIGHT = SupportedDates.FIRST;
    static final LocalDate LAST_NIGHT = SupportedDates.LAST;

    private final PluginRegistry plugins;
    private final RequestService requests;
    private final ProgramRepository programs;
    private final Validator validator;
    private final TransactionTemplate tx;

    RequestImports(PluginRegistry plugins, RequestService requests, ProgramRepository programs, Validator validator,
                   PlatformTransactionManager transactions) {
        this.plugins = plugins;
        this.requests = requests;
        this.programs = programs;
        this.validator = validator;
        this.tx = new TransactionTemplate(transactions);
    }

    /** The media types some importer reads. */
    public List<String> mediaTypes() {
        return plugins.requestImporters().stream().map(RequestImporter::mediaType).distinct().toList();
    }

    public Optional<RequestImporter> importer(String mediaType) {
        return plugins.requestImporter(mediaType);
    }

    /**
     * Reads the file with {@code importer} and stores every request as a draft of its owner, or none.
     *
     * @return the stored requests, in the file's order
     * @throws InvalidParametersException listing every problem; then nothing is stored
     */
    public List<RequestView> importAll(RequestImporter importer, InputStream in) throws IOException {
        ImportResult read = importer.read(in);
        if (!read.isAccepted()) {
            throw new InvalidParametersException(read.problems().stream().map(RequestImports::problem).toList());
        }
        if (read.requests().isEmpty()) {
            throw new InvalidParametersException(List.of(new FieldProblem("file", "holds no requests")));
        }
        List<FieldProblem> problems = new ArrayList<>();
        List<RequestView> stored = tx.execute(status -> {
            List<RequestView> out = new ArrayList<>();
            // Read once for the whole file, not once a record.
            List<Program> known = programs.findAll();
            for (int i = 0; i < read.requests().size(); i++) {
                String where = "record " + (i + 1) + ": ";
                try {
                    RequestForm form = form(read.requests().get(i), where, known);
                    out.add(requests.create(form));
                } catch (InvalidParametersException e) {
                    e.problems().forEach(p -> problems.add(p.field().startsWith("record ") ? p
                            : new FieldProblem(where + p.field(), p.message())));
                }
            }
            if (!problems.isEmpty()) {
                status.setRollbackOnly();
            }
            return out;
        });
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
        return stored;
    }

    /** The form a user would have sent for {@code r}, checked as the form is. */
    RequestForm form(RequestRecord r, String where) {
        return form(r, where, programs.findAll());
    }

    private RequestForm form(RequestRecord r, String where, List<Program> stored) {
        List<FieldProblem> problems = new ArrayList<>();
        Long programId = program(r.program(), stored).map(Program::getId).orElse(null);
        if (programId == null) {
            problems.add(new FieldProblem(where + "program", "names no stored program (by code or title): " + r.program()));
        }
        DarknessLimit darkness = null;
        if (r.darkness() != null && !r.darkness().isBlank()) {
            try {
                darkness = DarknessLimit.valueOf(r.darkness().trim().toUpperCase(Locale.ROOT));
            } catch (IllegalArgumentException e) {
                problems.add(new FieldProblem(where + "darkness", "must be astronomical, nautical or civil: " + r.darkness()));
            }
        }
        RequestForm form = new RequestForm(null, programId == null ? -1L : programId, r.owner(), r.targetName(),
                plain(r.raDeg()), plain(r.decDeg()),
                null, null,
                r.exposures().stream().map(e -> new RequestForm.ExposureForm(e.filter(), e.seconds(), e.count())).toList(),
                r.minAltitudeDeg(), darkness, r.minMoonSeparationDeg(), r.maxMoonIllumination(), r.maxAirmass(), r.earliestNight(),
                r.latestNight(), r.repeats(), r.intervalDays() > 0 ? r.intervalDays() * 24.0 : null, null, r.priority(),
                r.targetKind(), r.targetParameters());
        for (ConstraintViolation<RequestForm> v : validator.validate(form)) {
            problems.add(new FieldProblem(where + v.getPropertyPath(), v.getMessage()));
        }
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
        return form;
    }

    /** Decimal degrees as the form's text, without an exponent ({@code 1.0E-5} is not a coordinate as typed). */
    private static String plain(Double degrees) {
        return degrees == null ? null : new BigDecimal(Double.toString(degrees)).toPlainString();
    }

    private static Optional<Program> program(String codeOrTitle, List<Program> stored) {
        if (codeOrTitle == null || codeOrTitle.isBlank()) {
            return Optional.empty();
        }
        String wanted = codeOrTitle.trim();
        return stored.stream()
                .filter(p -> wanted.equalsIgnoreCase(p.getCode()) || wanted.equalsIgnoreCase(p.getTitle()))
                .findFirst();
    }

    private static FieldProblem problem(ImportProblem p) {
        return new FieldProblem("line " + p.line() + (p.field() == null ? "" : ": " + p.field()), p.message());
    }
}
