package org.skyrota.web.report;

import java.time.Clock;
import java.time.Instant;
import java.util.List;

import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.springframework.data.domain.Sort;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** API tokens for telescopes (admins) and calendar-feed tokens (everyone, for themselves). */
@Service
@Transactional
public class TokenService {

    /** What a token may do: send observation reports, or read the published plan and its exports. */
    public static final List<String> SCOPES = List.of("reports", "read");

    private final ApiTokenRepository tokens;
    private final FeedTokenRepository feeds;
    private final TelescopeRepository telescopes;
    private final AuditLog audit;
    private final Clock clock;

    TokenService(ApiTokenRepository tokens, FeedTokenRepository feeds, TelescopeRepository telescopes, AuditLog audit,
                 Clock clock) {
        this.clock = clock;
        this.tokens = tokens;
        this.feeds = feeds;
        this.telescopes = telescopes;
        this.audit = audit;
    }

    public record TokenView(long id, String name, long telescopeId, String scope, String createdBy, Instant createdAt,
                            Instant revokedAt) {
        static TokenView of(ApiToken t) {
            return new TokenView(t.getId(), t.getName(), t.getTelescopeId(), t.getScope(), t.getCreatedBy(),
                    t.getCreatedAt(), t.getRevokedAt());
        }
    }

    /** The token itself appears here once and is never shown again. */
    public record NewToken(long id, String name, long telescopeId, String scope, String token, Instant createdAt) {
        /** Spring MVC logs the bodies it writes at DEBUG; the token goes to the client only. */
        @Override
        public String toString() {
            return "NewToken[id=" + id + ", name=" + name + ", telescopeId=" + telescopeId + ", scope=" + scope + ", token=(hidden)]";
        }
    }

    public NewToken create(String name, Long telescopeId, String scope) {
        if (name == null || name.isBlank() || name.length() > 100) {
            throw new InvalidParametersException(List.of(new FieldProblem("name", "must be 1 to 100 characters")));
        }
        if (telescopeId == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("telescopeId", "must be given")));
        }
        String s = scope == null ? "reports" : scope;
        if (!SCOPES.contains(s)) {
            throw new InvalidParametersException(List.of(new FieldProblem("scope", "must be one of " + SCOPES)));
        }
        if (!telescopes.existsById(telescopeId)) {
            throw new NotFoundException("telescope", telescopeId);
        }
        String token = TokenText.newToken();
        ApiToken saved = tokens.saveAndFlush(new ApiToken(name.trim(), telescopeId, s, TokenText.hash(token),
                CurrentUser.get().username()));
        audit.record("create", "api-token", saved.getId(), null, TokenView.of(saved));
        return new NewToken(saved.getId(), saved.getName(), saved.getTelescopeId(), saved.getScope(), token, saved.getCreatedAt());
    }

    @Transactional(readOnly = true)
    public List<TokenView> list() {
        return tokens.findAll(Sort.by("id")).stream().map(TokenView::of).toList();
    }

    public void revoke(long id) {
        ApiToken t = tokens.findById(id).orElseThrow(() -> new NotFoundException("API token", id));
        TokenView before = TokenView.of(t);
        t.revoke(clock.instant());
        tokens.flush();
        audit.record("state:revoked", "api-token", id, before, TokenView.of(t));
    }

    public record FeedTokenView(String token, String url) {
        /** Spring MVC logs the bodies it writes at DEBUG; the token goes to the client only. */
        @Override
        public String toString() {
            return "FeedTokenView[token=(hidden)]";
        }
    }

    /** A new calendar-feed token for the signed-in person; an earlier one stops working. */
    public FeedTokenView newFeedToken() {
        String user = CurrentUser.get().username();
        String token = TokenText.newToken();
        String hash = TokenText.hash(token);
        feeds.findById(user).ifPresentOrElse(f -> f.replace(hash, clock.instant()),
                () -> feeds.save(new FeedToken(user, hash, clock.instant())));
        return new FeedTokenView(token, "/api/calendar/mine.ics?token=" + token);
    }
}
