package org.skyrota.web.system;

import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.not;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import jakarta.validation.Valid;
import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import jakarta.validation.constraints.NotBlank;

import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.boot.webmvc.test.autoconfigure.WebMvcTest;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** Every kind of failure leaves the server as a problem document (RFC 9457) with the right status. */
@WebMvcTest(ProblemAdviceTest.ProbeController.class)
@AutoConfigureMockMvc(addFilters = false)
@Import({ProblemAdvice.class, ProblemAdviceTest.ProbeController.class})
class ProblemAdviceTest {

    @Autowired
    MockMvc mvc;

    @RestController
    static class ProbeController {
        record Body(@NotBlank String name, @Min(1) @Max(5) int priority) {}

        @PostMapping(path = "/probe/body", consumes = MediaType.APPLICATION_JSON_VALUE)
        String body(@Valid @RequestBody Body body) {
            return body.name();
        }

        @GetMapping("/probe/count")
        String count(@RequestParam int count) {
            return "x".repeat(count);
        }

        @GetMapping("/probe/race")
        String race() {
            throw new org.springframework.orm.ObjectOptimisticLockingFailureException("Site", 7L);
        }

        @GetMapping("/probe/fail")
        String fail() {
            throw new IllegalStateException("secret internal detail");
        }
    }

    @Test
    void unknownPathIs404ProblemDocument() throws Exception {
        problem(mvc.perform(get("/api/no-such-thing")), 404)
                .andExpect(jsonPath("$.title").value("Not Found"))
                .andExpect(jsonPath("$.instance").value("/api/no-such-thing"));
    }

    @Test
    void wrongMethodIs405() throws Exception {
        problem(mvc.perform(post("/probe/count")), 405);
    }

    @Test
    void wrongContentTypeIs415() throws Exception {
        problem(mvc.perform(post("/probe/body").contentType(MediaType.TEXT_PLAIN).content("hello")), 415);
    }

    @Test
    void invalidBodyFieldIs400NamingTheField() throws Exception {
        problem(mvc.perform(post("/probe/body").contentType(MediaType.APPLICATION_JSON).content("{\"name\":\"m31\",\"priority\":9}")), 400)
                .andExpect(jsonPath("$.parameter").value("priority"))
                .andExpect(jsonPath("$.errors[0].field").value("priority"))
                .andExpect(jsonPath("$.errors[0].message").value(containsString("5")));
    }

    @Test
    void unreadableBodyIs400() throws Exception {
        problem(mvc.perform(post("/probe/body").contentType(MediaType.APPLICATION_JSON).content("{\"name\":")), 400);
    }

    @Test
    void typeMismatchIs400NamingTheParameter() throws Exception {
        problem(mvc.perform(get("/probe/count?count=many")), 400)
                .andExpect(jsonPath("$.parameter").value("count"))
                .andExpect(jsonPath("$.errors[0].message").value(containsString("many")));
    }

    @Test
    void missingParameterIs400NamingTheParameter() throws Exception {
        problem(mvc.perform(get("/probe/count")), 400)
                .andExpect(jsonPath("$.parameter").value("count"))
                .andExpect(jsonPath("$.errors[0].message").value("is required"));
    }

    @Test
    void editThatLostARaceIs409() throws Exception {
        problem(mvc.perform(get("/probe/race")), 409)
                .andExpect(jsonPath("$.type").value("urn:skyrota:problem:stale-version"));
    }

    @Test
    void unexpectedFailureIs500WithoutInternals() throws Exception {
        problem(mvc.perform(get("/probe/fail")), 500)
                .andExpect(content().string(not(containsString("secret"))))
                .andExpect(content().string(not(containsString("IllegalStateException"))))
                .andExpect(content().string(not(containsString("at org."))));
    }

    private static ResultActions problem(ResultActions result, int status) throws Exception {
        return result.andExpect(status().is(status))
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.status").value(status))
                .andExpect(jsonPath("$.type").isNotEmpty())
                .andExpect(jsonPath("$.title").isNotEmpty())
                .andExpect(jsonPath("$.detail").isNotEmpty());
    }
}
