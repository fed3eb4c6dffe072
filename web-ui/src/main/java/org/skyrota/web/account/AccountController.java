package org.skyrota.web.account;

import java.net.URI;
import java.util.List;

import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;

import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.springframework.data.domain.Sort;
import org.springframework.http.ResponseEntity;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

/** Who am I (everyone signed in), and the list and creation of accounts (admins). */
@RestController
@RequestMapping("/api/accounts")
class AccountController {

    private final AccountRepository accounts;
    private final PasswordEncoder encoder;
    private final AuditLog audit;

    AccountController(AccountRepository accounts, PasswordEncoder encoder, AuditLog audit) {
        this.accounts = accounts;
        this.audit = audit;
        this.encoder = encoder;
    }

    record AccountView(String username, Role role, boolean enabled) {
        static AccountView of(Account a) {
            return new AccountView(a.getUsername(), a.getRole(), a.isEnabled());
        }
    }

    record NewAccount(
            @NotBlank @Size(max = 100) @Pattern(regexp = "[A-Za-z0-9._-]+", message = "may hold letters, digits, '.', '_' and '-' only") String username,
            @NotBlank @Size(min = 8, max = 72, message = "must be 8 to 72 characters long") String password,
            @NotNull Role role) {}

    @GetMapping("/me")
    AccountView me() {
        CurrentUser user = CurrentUser.get();
        return accounts.findByUsername(user.username()).map(AccountView::of)
                .orElseGet(() -> new AccountView(user.username(), user.reviewer() ? Role.COORDINATOR : Role.REQUESTER, true));
    }

    @GetMapping
    @Transactional(readOnly = true)
    List<AccountView> list() {
        return accounts.findAll(Sort.by("username")).stream().map(AccountView::of).toList();
    }

    @PostMapping
    @Transactional
    ResponseEntity<AccountView> create(@Valid @RequestBody NewAccount form) {
        if (accounts.existsByUsername(form.username())) {
            throw new ConflictException("An account named '" + form.username() + "' exists already");
        }
        Account a = accounts.saveAndFlush(new Account(form.username(), encoder.encode(form.password()), form.role()));
        audit.record("create", "account", a.getId(), null, AccountView.of(a));
        return ResponseEntity.created(URI.create("/api/accounts/" + a.getUsername())).body(AccountView.of(a));
    }
}
