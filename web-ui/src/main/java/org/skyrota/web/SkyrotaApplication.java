package org.skyrota.web;

import org.springframework.boot.SpringApplication;
import org.springframework.boot.autoconfigure.SpringBootApplication;

/** Starts the Skyrota server. */
@SpringBootApplication
@org.springframework.scheduling.annotation.EnableScheduling
public class SkyrotaApplication {

    public static void main(String[] args) {
        SpringApplication.run(SkyrotaApplication.class, args);
    }
}
