package org.skyrota.web.system;

/** One bad request parameter or body field and what is wrong with it, as shown in a problem document. */
public record FieldProblem(String field, String message) {}
