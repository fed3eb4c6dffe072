package org.skyrota.web.demo;

import org.springframework.boot.ApplicationArguments;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

/** Tells a page or a script whether this server runs on demo data, so that the start page can say so. */
@RestController
class DemoMode {

    private final boolean demo;

    DemoMode(ApplicationArguments args) {
        this.demo = args.containsOption("demo");
    }

    record About(String name, boolean demo) {}

    @GetMapping("/api/about")
    About about() {
        return new About("Skyrota", demo);
    }
}
