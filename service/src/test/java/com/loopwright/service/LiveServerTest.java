package com.loopwright.service;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;

/** Base of test classes that share one real server on a free port for all their tests. */
abstract class LiveServerTest {

    static LiveServer server;

    @BeforeAll
    static void startServer() {
        server = LiveServer.start();
    }

    @AfterAll
    static void stopServer() {
        server.close();
    }
}
