package org.specimenledger;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.methods;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.junit.AnalyzeClasses;
import com.tngtech.archunit.junit.ArchTest;
import com.tngtech.archunit.lang.ArchCondition;
import com.tngtech.archunit.lang.ArchRule;
import com.tngtech.archunit.lang.ConditionEvents;
import com.tngtech.archunit.lang.SimpleConditionEvent;
import jakarta.persistence.Embeddable;
import jakarta.persistence.Entity;
import org.springframework.data.repository.Repository;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.RequestMapping;

/**
 * The shape of the code, checked on every build: a pure computation core, features that do not reach
 * into each other's storage, no cycles between features, and no endpoint without a declared role.
 */
@AnalyzeClasses(packages = "org.specimenledger", importOptions = ImportOption.DoNotIncludeTests.class)
class ArchitectureTest {

    /** Curve reading and analysis use the JDK and one number parser, nothing else: no Spring, JPA, servlet, JSON. */
    @ArchTest
    static final ArchRule coreIsPure = classes().that()
            .resideInAnyPackage("org.specimenledger.curve..", "org.specimenledger.analysis..")
            .should().onlyDependOnClassesThat().resideInAnyPackage(
                    "java..", "ch.randelshofer.fastdoubleparser..",
                    "org.specimenledger.curve..", "org.specimenledger.analysis..")
            .allowEmptyShould(true);

    /** One feature refers to another through its public API, and the dependencies form no cycle. */
    @ArchTest
    static final ArchRule featuresHaveNoCycles = slices().matching("org.specimenledger.(*)..")
            .should().beFreeOfCycles();

    /** Entities, embeddables and repositories are a feature's internals: only its own package touches them. */
    @ArchTest
    static final ArchRule storageStaysInsideItsFeature = classes().that().areAnnotatedWith(Entity.class)
            .or().areAnnotatedWith(Embeddable.class)
            .or().areAssignableTo(Repository.class)
            .should(beUsedOnlyFromTheirOwnPackage());

    /** Every endpoint names the roles allowed to call it; a forgotten one fails here, not in production. */
    @ArchTest
    static final ArchRule everyEndpointDeclaresItsRoles = methods().that().areMetaAnnotatedWith(RequestMapping.class)
            .or().areAnnotatedWith(RequestMapping.class)
            .should().beAnnotatedWith(PreAuthorize.class);

    private static ArchCondition<JavaClass> beUsedOnlyFromTheirOwnPackage() {
        return new ArchCondition<>("be used only from their own package") {
            @Override
            public void check(JavaClass target, ConditionEvents events) {
                target.getDirectDependenciesToSelf().forEach(dependency -> {
                    JavaClass origin = dependency.getOriginClass();
                    if (!origin.getPackageName().equals(target.getPackageName())) {
                        events.add(SimpleConditionEvent.violated(dependency, dependency.getDescription()));
                    }
                });
            }
        };
    }

}
