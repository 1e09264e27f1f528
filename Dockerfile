# Build stage: compiles and packages the fat jar (tests run in CI, not in the image build).
FROM maven:3.9-eclipse-temurin-17 AS build
WORKDIR /src
COPY pom.xml openapi.yaml ./
COPY solver solver
COPY api api
COPY service service
COPY client-examples client-examples
COPY bench bench
RUN mvn -B -q package -DskipTests

# Run stage: JRE only, unprivileged user, health probe on the bundled client-free checker.
FROM eclipse-temurin:17-jre
RUN groupadd --system loopwright && useradd --system --gid loopwright --uid 10001 --no-create-home loopwright
COPY --from=build /src/service/target/loopwright.jar /opt/loopwright/loopwright.jar
USER 10001:10001
ENV LOOPWRIGHT_PORT=8080
EXPOSE 8080
HEALTHCHECK --interval=15s --timeout=3s --start-period=10s --retries=3 \
  CMD ["java", "-cp", "/opt/loopwright/loopwright.jar", "com.loopwright.service.HealthProbe"]
# A JVM that ran out of memory exits (and is restarted) instead of serving on with half-dead threads.
ENTRYPOINT ["java", "-XX:MaxRAMPercentage=75", "-XX:+ExitOnOutOfMemoryError", "-jar", "/opt/loopwright/loopwright.jar"]
