package org.skyrota.web.report;

import java.util.List;

import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

@RestController
class TokenController {

    private final TokenService service;

    TokenController(TokenService service) {
        this.service = service;
    }

    record TokenForm(String name, Long telescopeId, String scope) {}

    @PostMapping("/api/tokens")
    @ResponseStatus(HttpStatus.CREATED)
    TokenService.NewToken create(@RequestBody TokenForm form) {
        return service.create(form.name(), form.telescopeId(), form.scope());
    }

    @GetMapping("/api/tokens")
    List<TokenService.TokenView> list() {
        return service.list();
    }

    @DeleteMapping("/api/tokens/{id}")
    @ResponseStatus(HttpStatus.NO_CONTENT)
    void revoke(@PathVariable long id) {
        service.revoke(id);
    }

    @PostMapping("/api/accounts/me/feed-token")
    @ResponseStatus(HttpStatus.CREATED)
    TokenService.FeedTokenView feedToken() {
        return service.newFeedToken();
    }
}
