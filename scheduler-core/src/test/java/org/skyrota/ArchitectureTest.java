package org.skyrota;

import static org.assertj.core.api.Assertions.assertThat;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import com.tngtech.archunit.lang.EvaluationResult;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** Keeps the layers of scheduler-core apart, as DEVELOPERS.md describes them. */
class ArchitectureTest {

    private static JavaClasses core;

    @BeforeAll
    static void importCore() {
        core = new ClassFileImporter()
                .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.skyrota");
    }

    @Test
    void coreKnowsNothingOfSpringJpaOrHttp() {
        assertHolds(noClasses().should().dependOnClassesThat().resideInAnyPackage(
                        "org.springframework..", "jakarta.persistence..", "jakarta.servlet..",
                        "org.hibernate..", "java.net.http.."),
                core);
    }

    @Test
    void skyEngineDoesNotDependOnThePlanner() {
        assertHolds(noClasses().that().resideInAPackage("org.skyrota.sky..")
                .should().dependOnClassesThat().resideInAPackage("org.skyrota.planning..")
                .allowEmptyShould(true),
                core);
    }

    @Test
    void skyEngineDoesNotDependOnTheSolver() {
        assertHolds(noClasses().that().resideInAPackage("org.skyrota.sky..")
                .should().dependOnClassesThat().resideInAPackage("org.optaplanner..")
                .allowEmptyShould(true),
                core);
    }

    /** Evaluates {@code rule} and fails with ArchUnit's report of every violation. */
    private static void assertHolds(ArchRule rule, JavaClasses classes) {
        EvaluationResult result = rule.evaluate(classes);
        assertThat(result.hasViolation()).as(result.getFailureReport().toString()).isFalse();
    }
}
