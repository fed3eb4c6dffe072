package org.skyrota.web.account;

import java.net.URI;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

import jakarta.validation.Validator;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;

import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.springframework.data.domain.Sort;
import org.springframework.http.ResponseEntity;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

/** Who am I and my password (everyone signed in); listing, creating and changing accounts (admins). */
@RestController
@RequestMapping("/api/accounts")
class AccountController {

    private final AccountRepository accounts;
    private final PasswordEncoder encoder;
    private final AuditLog audit;
    private final Validator validator;

    AccountController(AccountRepository accounts, PasswordEncoder encoder, AuditLog audit, Validator validator) {
        this.accounts = accounts;
        this.validator = validator;
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
            String password,
            @NotNull Role role) {
        // Spring MVC logs the bodies it reads at DEBUG: never the password.
        @Override
        public String toString() {
            return "NewAccount[username=" + username + ", role=" + role + ", password=(hidden)]";
        }
    }

    record PasswordChange(String currentPassword, String newPassword) {
        @Override
        public String toString() {
            return "PasswordChange[(hidden)]";
        }
    }

    /**
     * What an admin may change; absent members stay as they are. {@code username}, as an account read back carries it,
     * is taken when it names the account of the path (so that what a GET answers can be sent back); an account is
     * never renamed.
     */
    record AccountChange(String username, Role role, Boolean enabled, String password) {
        @Override
        public String toString() {
            return "AccountChange[username=" + username + ", role=" + role + ", enabled=" + enabled + ", password="
                    + (password == null ? "unchanged" : "(hidden)") + "]";
        }
    }

    /*
     * Passwords are checked here rather than by Bean Validation: a refused value ends up in the exception's message
     * ("rejected value [...]"), and Spring MVC logs that message at DEBUG. The other members keep their annotations;
     * every problem, of either kind, is answered together.
     */
    private void check(Object form, List<FieldProblem> passwordProblems) {
        List<FieldProblem> problems = new ArrayList<>();
        validator.validate(form).forEach(v -> problems.add(new FieldProblem(v.getPropertyPath().toString(), v.getMessage())));
        problems.addAll(passwordProblems);
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
    }

    /**
     * The rule for a new password: not blank, 8 to 72 characters and at most 72 bytes in UTF-8. Spring Security's
     * bcrypt refuses to hash more than 72 bytes (an IllegalArgumentException), so 72 characters with accents or
     * other non-ASCII letters used to end in a 500.
     */
    private static List<FieldProblem> newPassword(String field, String value, boolean required) {
        if (value == null) {
            return required ? List.of(new FieldProblem(field, "must not be blank")) : List.of();
        }
        if (value.isBlank()) {
            return List.of(new FieldProblem(field, "must not be blank"));
        }
        if (value.length() < 8 || value.length() > 72) {
            return List.of(new FieldProblem(field, "must be 8 to 72 characters long"));
        }
        return value.getBytes(StandardCharsets.UTF_8).length > 72
                ? List.of(new FieldProblem(field, "must be at most 72 bytes in UTF-8 (fewer characters when they are not ASCII)"))
                : List.of();
    }

    @GetMapping("/me")
    AccountView me() {
        CurrentUser user = CurrentUser.get();
        return accounts.findByUsername(user.username()).map(AccountView::of)
                .orElseGet(() -> new AccountView(user.username(), user.reviewer() ? Role.COORDINATOR : Role.REQUESTER, true));
    }

    @PutMapping("/me/password")
    @Transactional
    ResponseEntity<Void> changeOwnPassword(@RequestBody PasswordChange change) {
        List<FieldProblem> problems = new ArrayList<>();
        if (change.currentPassword() == null || change.currentPassword().isBlank()) {
            problems.add(new FieldProblem("currentPassword", "must not be blank"));
        }
        problems.addAll(newPassword("newPassword", change.newPassword(), true));
        check(change, problems);
        Account a = accounts.findByUsername(CurrentUser.get().username())
                .orElseThrow(() -> new NotFoundException("account", CurrentUser.get().username()));
        if (!encoder.matches(change.currentPassword(), a.getPasswordHash())) {
            throw new InvalidParametersException(List.of(new FieldProblem("currentPassword", "is not the current password")));
        }
        a.setPasswordHash(encoder.encode(change.newPassword()));
        audit.record("password", "account", a.getId(), null, null);
        return ResponseEntity.noContent().build();
    }

    @PutMapping("/{username}")
    @Transactional
    AccountView change(@PathVariable String username, @RequestBody AccountChange change) {
        List<FieldProblem> problems = new ArrayList<>(newPassword("password", change.password(), false));
        if (change.username() != null && !change.username().equals(username)) {
            problems.add(0, new FieldProblem("username", "an account cannot be renamed: this is " + username));
        }
        check(change, problems);
        Account a = accounts.findByUsername(username).orElseThrow(() -> new NotFoundException("account", username));
        AccountView before = AccountView.of(a);
        boolean losesAdmin = a.getRole() == Role.ADMIN && a.isEnabled()
                && ((change.role() != null && change.role() != Role.ADMIN) || Boolean.FALSE.equals(change.enabled()));
        if (losesAdmin && accounts.findAll().stream().filter(x -> x.getRole() == Role.ADMIN && x.isEnabled()).count() <= 1) {
            throw new ConflictException("This is the last enabled admin; make another admin first");
        }
        if (change.role() != null) {
            a.setRole(change.role());
        }
        if (change.enabled() != null) {
            a.setEnabled(change.enabled());
        }
        if (change.password() != null) {
            a.setPasswordHash(encoder.encode(change.password()));
        }
        AccountView after = AccountView.of(accounts.saveAndFlush(a));
        audit.record(change.password() != null ? "update+password" : "update", "account", a.getId(), before, after);
        return after;
    }

    @GetMapping
    @Transactional(readOnly = true)
    List<AccountView> list() {
        return accounts.findAll(Sort.by("username")).stream().map(AccountView::of).toList();
    }

    @PostMapping
    @Transactional
    ResponseEntity<AccountView> create(@RequestBody NewAccount form) {
        check(form, newPassword("password", form.password(), true));
        if (accounts.existsByUsername(form.username())) {
            throw new ConflictException("An account named '" + form.username() + "' exists already");
        }
        Account a = accounts.saveAndFlush(new Account(form.username(), encoder.encode(form.password()), form.role()));
        audit.record("create", "account", a.getId(), null, AccountView.of(a));
        return ResponseEntity.created(URI.create("/api/accounts/" + a.getUsername())).body(AccountView.of(a));
    }
}
