package com.loopwright.service.structure;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.tngtech.archunit.base.DescribedPredicate;
import com.tngtech.archunit.core.domain.Dependency;
import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.domain.JavaConstructorCall;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The structure picture of the production code, checked on the compiled classes (ArchUnit): modules layer one
 * way (service -> api -> solver), no package cycle inside a module, and the api sees the solver only through its
 * front door and its input and result records: its sources name at most {@value #MAX_SOLVER_PACKAGES_SEEN_BY_API}
 * solver packages (the measure, read from the source text), the compiled api reaches no other solver
 * package (no var or accessor chain hides one), and it runs no solver machinery (it constructs solver records and
 * enums, never a solver class outside the front door).
 */
class ArchitectureTest {

    /** The bound on how much of the solver the wire layer may know (common practice: a narrow facade). */
    private static final int MAX_SOLVER_PACKAGES_SEEN_BY_API = 5;
    /** The api's production sources, relative to the service module's base directory. */
    private static final String API_SOURCES = "../api/src/main/java";
    /** Cap on the folder depth walked under the api sources (com/loopwright/api/<package> is 4 deep). */
    private static final int MAX_SOURCE_DEPTH = 16;
    /** Cap on the source files read; the api has about a hundred. */
    private static final int MAX_SOURCE_FILES = 2_000;
    /** Every solver package starts so. */
    private static final String SOLVER_PREFIX = "com.loopwright.solver.";
    /** The front door: the only solver package whose classes the api may construct. */
    private static final String SOLVER_FRONT_DOOR = "com.loopwright.solver.pipeline";
    /** A solver package named in source text, as the issue measures it (imports and qualified names). */
    private static final Pattern SOLVER_PACKAGE_NAME = Pattern.compile("com\\.loopwright\\.solver\\.([a-z][a-z0-9]*)");

    /**
     * The production classes of every module. Jars are not excluded: in a reactor {@code test} the solver and the
     * api are class folders, in a reactor {@code verify} they are the packaged jars, and only the project's own
     * artifacts hold com.loopwright classes. An empty import fails every rule (ArchUnit's failOnEmptyShould).
     */
    private static final JavaClasses PRODUCTION = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("com.loopwright");

    @Test
    void theSolverKnowsNoWireOrHttpType() {
        noClasses()
                .that()
                .resideInAPackage("com.loopwright.solver..")
                .should()
                .dependOnClassesThat()
                .resideInAnyPackage(
                        "com.loopwright.api..", "com.loopwright.service..", "io.javalin..", "com.fasterxml.jackson..")
                .check(PRODUCTION);
    }

    @Test
    void theApiKnowsNoHttpServer() {
        noClasses()
                .that()
                .resideInAPackage("com.loopwright.api..")
                .should()
                .dependOnClassesThat()
                .resideInAnyPackage("com.loopwright.service..", "io.javalin..", "org.eclipse.jetty..")
                .check(PRODUCTION);
    }

    @Test
    void noPackageCycleInsideTheSolver() {
        slices().matching("com.loopwright.solver.(*)..")
                .should()
                .beFreeOfCycles()
                .check(PRODUCTION);
    }

    @Test
    void noPackageCycleInsideTheApi() {
        slices().matching("com.loopwright.api.(*)..").should().beFreeOfCycles().check(PRODUCTION);
    }

    @Test
    void noPackageCycleInsideTheService() {
        slices().matching("com.loopwright.service.(*)..")
                .should()
                .beFreeOfCycles()
                .check(PRODUCTION);
    }

    @Test
    void theApiSourcesNameAFewSolverPackagesOnly() throws IOException {
        Set<String> named = solverPackagesNamedInApiSources();
        assertTrue(named.contains("pipeline"), "the api must reach the solver through pipeline; it names " + named);
        assertTrue(
                named.size() <= MAX_SOLVER_PACKAGES_SEEN_BY_API,
                "the api sources name " + named.size() + " solver packages, at most " + MAX_SOLVER_PACKAGES_SEEN_BY_API
                        + " allowed: " + named);
    }

    /**
     * No dodging: a solver package the compiled api depends on (through var, a chain of accessors or a lambda) is
     * one its sources name, so the count above is the whole of what the api sees.
     */
    @Test
    void theCompiledApiReachesOnlyTheSolverPackagesItsSourcesName() throws IOException {
        Set<String> named = solverPackagesNamedInApiSources();
        Set<String> reached = new TreeSet<>();
        for (JavaClass type : PRODUCTION) {
            if (!type.getPackageName().startsWith("com.loopwright.api")) {
                continue;
            }
            for (Dependency dependency : type.getDirectDependenciesFromSelf()) {
                String target = dependency.getTargetClass().getPackageName();
                if (target.startsWith(SOLVER_PREFIX)) {
                    reached.add(target.substring(SOLVER_PREFIX.length()).split("\\.")[0]);
                }
            }
        }
        Set<String> unnamed = new TreeSet<>(reached);
        unnamed.removeAll(named);
        assertTrue(
                unnamed.isEmpty(),
                "the compiled api reaches solver packages its sources do not name: " + unnamed + " (reached " + reached
                        + ", named " + named + ")");
    }

    /** The solver packages named in the api's production sources (imports and qualified names). */
    private static Set<String> solverPackagesNamedInApiSources() throws IOException {
        Path root =
                Path.of(System.getProperty("basedir", ".")).resolve(API_SOURCES).normalize();
        assertTrue(Files.isDirectory(root), "no api sources at " + root);
        List<Path> sources;
        try (Stream<Path> walk = Files.walk(root, MAX_SOURCE_DEPTH)) {
            sources = walk.filter(p -> p.toString().endsWith(".java"))
                    .limit(MAX_SOURCE_FILES + 1L)
                    .toList();
        }
        assertTrue(
                !sources.isEmpty() && sources.size() <= MAX_SOURCE_FILES,
                sources.size() + " api source files under " + root);
        Set<String> named = new TreeSet<>();
        for (Path source : sources) {
            Matcher matcher = SOLVER_PACKAGE_NAME.matcher(Files.readString(source, StandardCharsets.UTF_8));
            while (matcher.find()) {
                named.add(matcher.group(1));
            }
        }
        return named;
    }

    @Test
    void theApiConstructsSolverRecordsAndEnumsOnly() {
        DescribedPredicate<JavaConstructorCall> solverMachinery =
                new DescribedPredicate<>("a constructor of a solver class outside " + SOLVER_FRONT_DOOR
                        + " that is neither a record nor an enum") {
                    @Override
                    public boolean test(JavaConstructorCall call) {
                        JavaClass owner = call.getTargetOwner();
                        String pkg = owner.getPackageName();
                        return pkg.startsWith(SOLVER_PREFIX)
                                && !pkg.startsWith(SOLVER_FRONT_DOOR)
                                && !owner.isRecord()
                                && !owner.isEnum();
                    }
                };
        noClasses()
                .that()
                .resideInAPackage("com.loopwright.api..")
                .should()
                .callConstructorWhere(solverMachinery)
                .check(PRODUCTION);
    }
}
