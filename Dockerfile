# syntax=docker/dockerfile:1
# Build stage: the service module and the modules it needs, nothing else (tests are neither compiled nor run
# here; CI runs them).
FROM maven:3.9-eclipse-temurin-17 AS build
WORKDIR /src
# Dependency layer: with only the poms, a package run downloads every plugin and dependency of the service and
# its modules. It is rebuilt only when a pom changes, so a source change does not download the world again.
# Every module of the root pom is listed (Maven reads them all); DeploymentFilesTest keeps this list complete.
COPY pom.xml ./
COPY solver/pom.xml solver/
COPY api/pom.xml api/
COPY service/pom.xml service/
COPY client-examples/pom.xml client-examples/
COPY bench/pom.xml bench/
COPY generated-client/pom.xml generated-client/
RUN mvn -B -q -pl service -am package -Dmaven.test.skip=true
# Source layer: offline, only the service and the modules below it.
COPY openapi.yaml ./
COPY solver/src solver/src
COPY api/src api/src
COPY service/src service/src
RUN mvn -B -q -o -pl service -am package -Dmaven.test.skip=true

# Run stage: JRE only, unprivileged user.
FROM eclipse-temurin:17-jre
ARG LOOPWRIGHT_VERSION=0.1.0
LABEL org.opencontainers.image.title="Loopwright" \
      org.opencontainers.image.description="Stateless HTTP service: state-feedback gains that meet step specs, with a certified H-infinity disturbance bound" \
      org.opencontainers.image.version="${LOOPWRIGHT_VERSION}"
RUN groupadd --system loopwright && useradd --system --gid loopwright --uid 10001 --no-create-home loopwright
COPY --from=build /src/service/target/loopwright.jar /opt/loopwright/loopwright.jar
USER 10001:10001
ENV LOOPWRIGHT_PORT=8080
EXPOSE 8080
# The health check speaks HTTP from bash (/dev/tcp): no second JVM every 15 s, and no curl needed in the image.
HEALTHCHECK --interval=15s --timeout=3s --start-period=10s --retries=3 \
  CMD ["bash", "-c", "exec 3<>/dev/tcp/127.0.0.1/${LOOPWRIGHT_PORT} && printf 'GET /health/live HTTP/1.1\\r\\nHost: localhost\\r\\nConnection: close\\r\\n\\r\\n' >&3 && head -n 1 <&3 | grep -q ' 200 '"]
# A JVM that ran out of memory exits (and is restarted) instead of serving on with half-dead threads. The serial
# collector is what the JVM picks by itself at the deployment's 2 CPUs and 768 MiB; named so that a larger limit does
# not switch to G1 (about 15 % fewer designs per second on 2 cores for this small live set; docs/benchmarks.md).
ENTRYPOINT ["java", "-XX:MaxRAMPercentage=75", "-XX:+ExitOnOutOfMemoryError", "-XX:+UseSerialGC", "-jar", "/opt/loopwright/loopwright.jar"]
