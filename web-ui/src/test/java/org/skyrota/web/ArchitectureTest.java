package org.skyrota.web;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.junit.AnalyzeClasses;
import com.tngtech.archunit.junit.ArchTest;
import com.tngtech.archunit.lang.ArchRule;

import org.springframework.data.repository.Repository;
import org.springframework.web.bind.annotation.RestController;

/** The server's house rules, checked on its compiled classes. */
@AnalyzeClasses(packages = "org.skyrota.web", importOptions = ImportOption.DoNotIncludeTests.class)
class ArchitectureTest {

    /** Entities become the sky engine's records in one place: the mappers and the compute adapter. */
    @ArchTest
    static final ArchRule onlyMappersTouchTheSkyEngine = noClasses()
            .that().haveSimpleNameNotEndingWith("Mapper")
            .and().doNotHaveFullyQualifiedName("org.skyrota.web.compute.EngineSkyComputations")
            .should().dependOnClassesThat().resideInAPackage("org.skyrota.sky..");

    @ArchTest
    static final ArchRule controllersArePackagePrivate = classes()
            .that().areAnnotatedWith(RestController.class)
            .should().notBePublic();

    /** Controllers speak to services; storage stays behind them, inside a transaction. */
    @ArchTest
    static final ArchRule controllersDoNotUseRepositoriesDirectly = noClasses()
            .that().areAnnotatedWith(RestController.class)
            .and().resideOutsideOfPackages("org.skyrota.web.account", "org.skyrota.web.system")
            .should().dependOnClassesThat().areAssignableTo(Repository.class);

    @ArchTest
    static final ArchRule featuresDoNotDependOnTheDemo = noClasses()
            .that().resideOutsideOfPackage("org.skyrota.web.demo..")
            .should().dependOnClassesThat().resideInAPackage("org.skyrota.web.demo..");
}
