package org.skyrota.web.support;

import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;

import org.junit.jupiter.api.extension.ConditionEvaluationResult;
import org.junit.jupiter.api.extension.ExecutionCondition;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.api.extension.ExtensionContext;

/**
 * Runs the annotated tests only when {@link LocalPostgres} answers, and says why otherwise.
 * Evaluated before Spring builds a context, so an absent server costs nothing.
 */
@Target(ElementType.TYPE)
@Retention(RetentionPolicy.RUNTIME)
@ExtendWith(EnabledIfPostgresReachable.Condition.class)
public @interface EnabledIfPostgresReachable {

    class Condition implements ExecutionCondition {
        private static volatile String reason;
        private static volatile boolean checked;

        @Override
        public ConditionEvaluationResult evaluateExecutionCondition(ExtensionContext context) {
            if (!checked) {
                reason = LocalPostgres.unreachableReason();
                checked = true;
            }
            return reason == null
                    ? ConditionEvaluationResult.enabled("PostgreSQL answers at " + LocalPostgres.URL)
                    : ConditionEvaluationResult.disabled("SKIPPED: PostgreSQL at " + LocalPostgres.URL
                            + " is unreachable (" + reason + "); CI starts it, locally run pg_ctlcluster or set SKYROTA_TEST_DB_URL");
        }
    }
}
