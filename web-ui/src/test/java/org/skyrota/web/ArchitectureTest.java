package org.skyrota.web;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static org.assertj.core.api.Assertions.assertThat;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import com.tngtech.archunit.lang.EvaluationResult;

import org.junit.jupiter.api.Test;

import org.springframework.data.repository.Repository;
import org.springframework.web.bind.annotation.RestController;

/** The server's house rules, checked on its compiled classes. */
class ArchitectureTest {

    static final JavaClasses SERVER = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.skyrota.web");

    /** Entities become the sky engine's records in one place: the mappers and the compute adapter. */
    static final ArchRule onlyMappersTouchTheSkyEngine = noClasses()
            .that().haveSimpleNameNotEndingWith("Mapper")
            .and().doNotHaveFullyQualifiedName("org.skyrota.web.compute.EngineSkyComputations")
            .should().dependOnClassesThat().resideInAPackage("org.skyrota.sky..");

    static final ArchRule controllersArePackagePrivate = classes()
            .that().areAnnotatedWith(RestController.class)
            .should().notBePublic();

    /** Controllers speak to services; storage stays behind them, inside a transaction. */
    static final ArchRule controllersDoNotUseRepositoriesDirectly = noClasses()
            .that().areAnnotatedWith(RestController.class)
            .and().resideOutsideOfPackages("org.skyrota.web.account", "org.skyrota.web.system")
            .should().dependOnClassesThat().areAssignableTo(Repository.class);

    static final ArchRule featuresDoNotDependOnTheDemo = noClasses()
            .that().resideOutsideOfPackage("org.skyrota.web.demo..")
            .should().dependOnClassesThat().resideInAPackage("org.skyrota.web.demo..");

    @Test
    void onlyMappersTouchTheSkyEngineHolds() {
        assertHolds(onlyMappersTouchTheSkyEngine, SERVER);
    }

    @Test
    void controllersArePackagePrivateHolds() {
        assertHolds(controllersArePackagePrivate, SERVER);
    }

    @Test
    void controllersDoNotUseRepositoriesDirectlyHolds() {
        assertHolds(controllersDoNotUseRepositoriesDirectly, SERVER);
    }

    @Test
    void featuresDoNotDependOnTheDemoHolds() {
        assertHolds(featuresDoNotDependOnTheDemo, SERVER);
    }

    /** Evaluates {@code rule} and fails with ArchUnit's report of every violation. */
    private static void assertHolds(ArchRule rule, JavaClasses classes) {
        EvaluationResult result = rule.evaluate(classes);
        assertThat(result.hasViolation()).as(result.getFailureReport().toString()).isFalse();
    }
}
