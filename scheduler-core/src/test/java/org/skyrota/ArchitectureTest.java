package org.skyrota;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
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
        noClasses().should().dependOnClassesThat().resideInAnyPackage(
                        "org.springframework..", "jakarta.persistence..", "jakarta.servlet..",
                        "org.hibernate..", "java.net.http..")
                .check(core);
    }

    @Test
    void skyEngineDoesNotDependOnThePlanner() {
        noClasses().that().resideInAPackage("org.skyrota.sky..")
                .should().dependOnClassesThat().resideInAPackage("org.skyrota.planning..")
                .allowEmptyShould(true)
                .check(core);
    }

    @Test
    void skyEngineDoesNotDependOnTheSolver() {
        noClasses().that().resideInAPackage("org.skyrota.sky..")
                .should().dependOnClassesThat().resideInAPackage("org.optaplanner..")
                .allowEmptyShould(true)
                .check(core);
    }
}
