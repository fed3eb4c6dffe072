package org.skyrota.web.account;

import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * Who is asking, as the services need it: a name and whether they may act on other people's
 * requests. Read from the security context of the current request.
 */
public record CurrentUser(String username, boolean reviewer) {

    /** The signed-in user; fails when nobody is signed in (the security rules prevent that on /api). */
    public static CurrentUser get() {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        if (auth == null || !auth.isAuthenticated()) {
            throw new IllegalStateException("no signed-in user");
        }
        boolean reviewer = auth.getAuthorities().stream().anyMatch(a ->
                a.getAuthority().equals(Role.COORDINATOR.authority()) || a.getAuthority().equals(Role.ADMIN.authority()));
        return new CurrentUser(auth.getName(), reviewer);
    }
}
