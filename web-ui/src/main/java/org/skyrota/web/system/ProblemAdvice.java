package org.skyrota.web.system;

import java.net.URI;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import jakarta.persistence.EntityManager;
import jakarta.persistence.EntityManagerFactory;
import jakarta.validation.ConstraintViolation;
import jakarta.validation.ConstraintViolationException;

import com.fasterxml.jackson.annotation.JsonProperty;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.TypeMismatchException;
import org.springframework.beans.factory.ObjectProvider;
import org.springframework.context.MessageSourceResolvable;
import org.springframework.context.i18n.LocaleContextHolder;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.dao.PessimisticLockingFailureException;
import org.springframework.data.core.PropertyReferenceException;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.http.converter.HttpMessageNotReadableException;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.validation.FieldError;
import org.springframework.web.ErrorResponse;
import org.springframework.web.bind.MethodArgumentNotValidException;
import org.springframework.web.bind.MissingServletRequestParameterException;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.context.request.NativeWebRequest;
import org.springframework.web.context.request.ServletWebRequest;
import org.springframework.web.context.request.WebRequest;
import org.springframework.web.method.annotation.HandlerMethodValidationException;
import org.springframework.web.servlet.mvc.method.annotation.ResponseEntityExceptionHandler;

import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.TokenStreamContext;
import tools.jackson.core.exc.StreamReadException;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.exc.MismatchedInputException;
import tools.jackson.databind.exc.UnrecognizedPropertyException;

/**
 * Turns every exception a handler throws into an RFC 9457 problem document with the right
 * status. Spring MVC's own exceptions (404 for an unknown path, 405, 406, 415, ...) are mapped by
 * the base class; the overrides add the {@code parameter} and {@code errors} members that name
 * what was wrong; anything unexpected becomes a 500 whose body says nothing of the internals.
 */
@RestControllerAdvice
public class ProblemAdvice extends ResponseEntityExceptionHandler {

    private static final URI ABOUT_BLANK = URI.create("about:blank");
    private static final Logger log = LoggerFactory.getLogger(ProblemAdvice.class);

    /** Absent in slice tests without storage. */
    private final ObjectProvider<EntityManagerFactory> storage;

    public ProblemAdvice(ObjectProvider<EntityManagerFactory> storage) {
        this.storage = storage;
    }

    @ExceptionHandler(InvalidParametersException.class)
    ResponseEntity<Object> invalidParameters(InvalidParametersException e, WebRequest request) {
        return badRequest(e, e.problems(), request);
    }

    @ExceptionHandler(ConstraintViolationException.class)
    ResponseEntity<Object> constraintViolation(ConstraintViolationException e, WebRequest request) {
        List<FieldProblem> problems = new ArrayList<>();
        for (ConstraintViolation<?> v : e.getConstraintViolations()) {
            problems.add(new FieldProblem(lastNode(v.getPropertyPath().toString()), v.getMessage()));
        }
        return badRequest(e, problems, request);
    }

    @ExceptionHandler(NotFoundException.class)
    ResponseEntity<Object> notFound(NotFoundException e, WebRequest request) {
        return problem(e, HttpStatus.NOT_FOUND, ProblemTypes.NOT_FOUND, "Not found", e.getMessage(), request);
    }

    @ExceptionHandler(StaleVersionException.class)
    ResponseEntity<Object> staleVersion(StaleVersionException e, WebRequest request) {
        ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.CONFLICT, e.getMessage());
        body.setType(ProblemTypes.STALE_VERSION);
        body.setTitle("Edited against an old version");
        body.setProperty("currentVersion", e.currentVersion());
        return handleExceptionInternal(e, body, new HttpHeaders(), HttpStatus.CONFLICT, request);
    }

    @ExceptionHandler(ObjectOptimisticLockingFailureException.class)
    ResponseEntity<Object> concurrentEdit(ObjectOptimisticLockingFailureException e, WebRequest request) {
        // Two edits raced past the version check: the loser is told the version that won, as a stale edit is.
        ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.CONFLICT,
                "Someone else changed this at the same moment; read it again and repeat the edit.");
        body.setType(ProblemTypes.STALE_VERSION);
        body.setTitle("Edited against an old version");
        Long current = currentVersion(e);
        if (current != null) {
            body.setProperty("currentVersion", current);
        }
        return handleExceptionInternal(e, body, new HttpHeaders(), HttpStatus.CONFLICT, request);
    }

    @ExceptionHandler(PessimisticLockingFailureException.class)
    ResponseEntity<Object> busy(PessimisticLockingFailureException e, WebRequest request) {
        // Another change held the row for longer than the database waits; nothing of this one was stored.
        log.info("A change waited too long for another one: {}", e.getMostSpecificCause().getMessage());
        return problem(e, HttpStatus.CONFLICT, ProblemTypes.CONFLICT, "Conflict",
                "Another change to the same data was under way; read it again and repeat the edit.", request);
    }

    /** The version that won a race, read afresh; null when it cannot be read (storage absent, entity gone). */
    private Long currentVersion(ObjectOptimisticLockingFailureException e) {
        EntityManagerFactory factory = storage.getIfAvailable();
        if (factory == null || e.getIdentifier() == null) {
            return null;
        }
        try (EntityManager em = factory.createEntityManager()) {
            Class<?> type = e.getPersistentClass() != null ? e.getPersistentClass() : Class.forName(e.getPersistentClassName());
            Object found = em.find(type, e.getIdentifier());
            return found instanceof StoredEntity stored ? stored.getVersion() : null;
        } catch (RuntimeException | ClassNotFoundException unreadable) {
            return null;
        }
    }

    @ExceptionHandler(org.springframework.security.access.AccessDeniedException.class)
    ResponseEntity<Object> forbidden(org.springframework.security.access.AccessDeniedException e, WebRequest request) {
        return problem(e, HttpStatus.FORBIDDEN, ProblemTypes.FORBIDDEN, "Forbidden", e.getMessage(), request);
    }

    @ExceptionHandler(ConflictException.class)
    ResponseEntity<Object> conflict(ConflictException e, WebRequest request) {
        if (e.details().isEmpty()) {
            return problem(e, HttpStatus.CONFLICT, ProblemTypes.CONFLICT, "Conflict", e.getMessage(), request);
        }
        ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.CONFLICT, e.getMessage());
        body.setType(ProblemTypes.CONFLICT);
        body.setTitle("Conflict");
        e.details().forEach(body::setProperty);
        return handleExceptionInternal(e, body, new HttpHeaders(), HttpStatus.CONFLICT, request);
    }

    @ExceptionHandler(DataIntegrityViolationException.class)
    ResponseEntity<Object> integrity(DataIntegrityViolationException e, WebRequest request) {
        log.info("Refused a change that breaks a stored rule: {}", e.getMostSpecificCause().getMessage());
        return problem(e, HttpStatus.CONFLICT, ProblemTypes.CONFLICT, "Conflict",
                "The change clashes with stored data (a duplicate name, or something still in use).", request);
    }

    @ExceptionHandler(PropertyReferenceException.class)
    ResponseEntity<Object> unknownSortProperty(PropertyReferenceException e, WebRequest request) {
        return badRequest(e, List.of(new FieldProblem("sort", "cannot sort by '" + e.getPropertyName() + "'")), request);
    }

    @ExceptionHandler(Exception.class)
    ResponseEntity<Object> unexpected(Exception e, WebRequest request) {
        if (StorageFailures.diskFull(e)) {
            // The transaction did not commit, so nothing of this change is stored; reads go on working.
            log.error("Disk full answering {}: nothing was stored; free space in the data directory", describe(request));
            ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.INSUFFICIENT_STORAGE,
                    "The server's disk is full, so nothing of this change was stored. Stored data can still be read; "
                            + "the change can be sent again once space is freed in the data directory.");
            body.setType(ProblemTypes.STORAGE_FULL);
            body.setTitle("Storage full");
            return handleExceptionInternal(e, body, new HttpHeaders(), HttpStatus.INSUFFICIENT_STORAGE, request);
        }
        if (StorageFailures.databaseClosed(e)) {
            log.warn("The database was closed after a storage failure answering {}; it opens again on the next call", describe(request));
            ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.SERVICE_UNAVAILABLE,
                    "The database is opening again after a storage failure; nothing of this call was stored. Try again.");
            body.setType(ProblemTypes.STORAGE_FULL);
            body.setTitle("Storage unavailable");
            HttpHeaders headers = new HttpHeaders();
            headers.set(HttpHeaders.RETRY_AFTER, "1");
            return handleExceptionInternal(e, body, headers, HttpStatus.SERVICE_UNAVAILABLE, request);
        }
        log.error("Unexpected failure answering {}", describe(request), e);
        ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.INTERNAL_SERVER_ERROR,
                "The server failed to answer this request; the failure has been logged.");
        body.setType(ProblemTypes.INTERNAL);
        return handleExceptionInternal(e, body, new HttpHeaders(), HttpStatus.INTERNAL_SERVER_ERROR, request);
    }

    @Override
    protected ResponseEntity<Object> handleMissingServletRequestParameter(
            MissingServletRequestParameterException e, HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        return badRequest(e, List.of(new FieldProblem(e.getParameterName(), "is required")), request);
    }

    @Override
    protected ResponseEntity<Object> handleTypeMismatch(
            TypeMismatchException e, HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        String name = e.getPropertyName() != null ? e.getPropertyName() : "value";
        String was = ", was '" + (e.getValue() == null ? null : SupportedDates.shortened(String.valueOf(e.getValue()))) + "'";
        if (e.getRequiredType() == LocalDate.class) {
            return badRequest(e, List.of(new FieldProblem(name, SupportedDates.DATE_RULE + was)), request);
        }
        if (e.getRequiredType() == Instant.class) {
            return badRequest(e, List.of(new FieldProblem(name, SupportedDates.INSTANT_RULE + was)), request);
        }
        String expected = e.getRequiredType() != null ? e.getRequiredType().getSimpleName() : "another type";
        return badRequest(e, List.of(new FieldProblem(name, "must be a " + expected + was)), request);
    }

    @Override
    protected ResponseEntity<Object> handleMethodArgumentNotValid(
            MethodArgumentNotValidException e, HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        List<FieldProblem> problems = new ArrayList<>();
        for (FieldError f : e.getBindingResult().getFieldErrors()) {
            problems.add(new FieldProblem(f.getField(), f.getDefaultMessage()));
        }
        e.getBindingResult().getGlobalErrors().forEach(g -> problems.add(new FieldProblem(g.getObjectName(), g.getDefaultMessage())));
        return badRequest(e, problems, request);
    }

    @Override
    protected ResponseEntity<Object> handleHandlerMethodValidationException(
            HandlerMethodValidationException e, HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        List<FieldProblem> problems = new ArrayList<>();
        e.getParameterValidationResults().forEach(result -> {
            String name = result.getMethodParameter().getParameterName();
            for (MessageSourceResolvable error : result.getResolvableErrors()) {
                String field = error instanceof FieldError f ? f.getField() : name;
                problems.add(new FieldProblem(field, error.getDefaultMessage()));
            }
        });
        return badRequest(e, problems, request);
    }

    @Override
    protected ResponseEntity<Object> handleHttpMessageNotReadable(
            HttpMessageNotReadableException e, HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        JacksonException json = jacksonCause(e);
        String field = json == null ? null : jsonField(json);
        if (field != null) {
            return badRequest(e, List.of(new FieldProblem(field, jsonMessage(json))), request);
        }
        ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST,
                "The request body is missing or is not valid JSON of the expected shape.");
        body.setType(ProblemTypes.INVALID_PARAMETERS);
        return handleExceptionInternal(e, body, headers, HttpStatus.BAD_REQUEST, request);
    }

    @Override
    protected ResponseEntity<Object> handleExceptionInternal(
            Exception e, Object body, HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        if (body == null && e instanceof ErrorResponse errorResponse) {
            body = errorResponse.updateAndGetBody(getMessageSource(), LocaleContextHolder.getLocale());
        }
        if (body instanceof ProblemDetail problem) {
            // RFC 9457 lets an absent type mean about:blank; clients read better when it is spelled out.
            if (problem.getType() == null) {
                problem.setType(ABOUT_BLANK);
            }
            if (problem.getInstance() == null && request instanceof ServletWebRequest web) {
                problem.setInstance(URI.create(web.getRequest().getRequestURI()));
            }
        }
        return super.handleExceptionInternal(e, body, headers, status, request);
    }

    private ResponseEntity<Object> problem(Exception e, HttpStatus status, URI type, String title, String detail, WebRequest request) {
        ProblemDetail body = ProblemDetail.forStatusAndDetail(status, detail);
        body.setType(type);
        body.setTitle(title);
        return handleExceptionInternal(e, body, new HttpHeaders(), status, request);
    }

    private ResponseEntity<Object> badRequest(Exception e, List<FieldProblem> problems, WebRequest request) {
        ProblemDetail body = ProblemDetail.forStatus(HttpStatus.BAD_REQUEST);
        body.setType(ProblemTypes.INVALID_PARAMETERS);
        body.setTitle("Invalid request parameters");
        body.setDetail(summary(problems));
        if (!problems.isEmpty()) {
            body.setProperty("parameter", problems.get(0).field());
        }
        body.setProperty("errors", problems.stream().map(p -> Map.of("field", p.field(), "message", p.message())).toList());
        return handleExceptionInternal(e, body, new HttpHeaders(), HttpStatus.BAD_REQUEST, request);
    }

    private static String summary(List<FieldProblem> problems) {
        StringBuilder text = new StringBuilder();
        for (FieldProblem p : problems) {
            text.append(text.length() == 0 ? "" : "; ").append(p.field()).append(' ').append(p.message());
        }
        return text.length() == 0 ? "The request is not valid." : text.toString();
    }

    private static JacksonException jacksonCause(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof JacksonException j) {
                return j;
            }
        }
        return null;
    }

    /**
     * The body field a JSON failure is about ({@code exposures[0].seconds}), or null when there is none (the JSON
     * itself is broken). A member given twice is named by the parser, not by the path, which ends at its object.
     */
    private static String jsonField(JacksonException j) {
        StringBuilder path = new StringBuilder();
        for (JacksonException.Reference ref : j.getPath()) {
            if (ref.getPropertyName() != null) {
                path.append(path.length() == 0 ? "" : ".").append(ref.getPropertyName());
            } else if (ref.getIndex() >= 0) {
                path.append('[').append(ref.getIndex()).append(']');
            }
        }
        if (duplicateMember(j) && j.processor() instanceof JsonParser parser && parser.currentName() != null) {
            path.append(path.length() == 0 ? "" : ".").append(parser.currentName());
        } else if (path.length() == 0 && j instanceof StreamReadException && j.processor() instanceof JsonParser parser) {
            // JSON broken inside a member the mapping had not reached (an unknown one, say): the body's member it is in.
            for (TokenStreamContext c = parser.streamReadContext(); c != null; c = c.getParent()) {
                if (c.inObject() && c.getParent() != null && c.getParent().inRoot() && c.currentName() != null) {
                    path.append(c.currentName());
                }
            }
        }
        return path.length() == 0 ? null : path.toString();
    }

    private static boolean duplicateMember(JacksonException j) {
        return j instanceof StreamReadException && j.getOriginalMessage() != null
                && j.getOriginalMessage().startsWith("Duplicate Object property");
    }

    /** What the member must be, in the words of the API (SERVER.md, "Strict input"), from the type Jackson wanted. */
    private static String jsonMessage(JacksonException j) {
        if (j instanceof UnrecognizedPropertyException u) {
            List<String> known = u.getKnownPropertyIds() == null ? List.of()
                    : u.getKnownPropertyIds().stream().map(String::valueOf).sorted().toList();
            return "is not a member of this body" + (known.isEmpty() ? "" : "; its members are " + String.join(", ", known));
        }
        if (duplicateMember(j)) {
            return "is given twice";
        }
        if (j instanceof StreamReadException) {
            return "is not valid JSON (NaN and Infinity are no JSON numbers; text is in double quotes)";
        }
        Class<?> type = j instanceof MismatchedInputException m ? m.getTargetType() : null;
        String was = j instanceof InvalidFormatException f && f.getValue() != null
                ? ", was " + (f.getValue() instanceof String text ? "'" + SupportedDates.shortened(text) + "'" : f.getValue()) : "";
        if (type == null) {
            return "has a value of the wrong type or form";
        }
        if (type == NumberOrText.class) {
            return NumberOrText.RULE;
        }
        if (type == LocalDate.class) {
            return SupportedDates.DATE_RULE + was;
        }
        if (type == Instant.class) {
            return SupportedDates.INSTANT_RULE + was;
        }
        if (type == Integer.class || type == int.class || type == Long.class || type == long.class
                || type == Short.class || type == short.class) {
            return "must be a whole number, a JSON number without a fraction" + was;
        }
        if (type == Double.class || type == double.class || type == Float.class || type == float.class) {
            return "must be a JSON number" + was;
        }
        if (type == Boolean.class || type == boolean.class) {
            return "must be true or false" + was;
        }
        if (type == String.class) {
            return "must be text, a JSON string" + was;
        }
        if (type.isEnum()) {
            return "must be one of " + String.join(", ", enumNames(type)) + was;
        }
        if (java.util.Collection.class.isAssignableFrom(type) || type.isArray()) {
            return "must be a JSON array";
        }
        return "must be a JSON object";
    }

    /** An enum's names as the JSON writes them: its {@code @JsonProperty} names where it has them. */
    private static List<String> enumNames(Class<?> type) {
        List<String> names = new ArrayList<>();
        for (Object constant : type.getEnumConstants()) {
            String name = ((Enum<?>) constant).name();
            try {
                JsonProperty property = type.getField(name).getAnnotation(JsonProperty.class);
                names.add(property != null && !property.value().isEmpty() ? property.value() : name);
            } catch (NoSuchFieldException e) {
                names.add(name);
            }
        }
        return names;
    }

    private static String lastNode(String path) {
        int dot = path.lastIndexOf('.');
        return dot < 0 ? path : path.substring(dot + 1);
    }

    private static String describe(WebRequest request) {
        return request instanceof NativeWebRequest n && n.getNativeRequest() instanceof jakarta.servlet.http.HttpServletRequest http
                ? http.getMethod() + " " + http.getRequestURI()
                : request.getDescription(false);
    }
}
