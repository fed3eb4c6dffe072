package org.skyrota.web.account;

import org.springframework.security.core.userdetails.User;
import org.springframework.security.core.userdetails.UserDetails;
import org.springframework.security.core.userdetails.UserDetailsService;
import org.springframework.security.core.userdetails.UsernameNotFoundException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Signs people in from the stored accounts. */
@Service
class AccountDetailsService implements UserDetailsService {

    private final AccountRepository accounts;

    AccountDetailsService(AccountRepository accounts) {
        this.accounts = accounts;
    }

    @Override
    @Transactional(readOnly = true)
    public UserDetails loadUserByUsername(String username) {
        Account a = accounts.findByUsername(username).orElseThrow(() -> new UsernameNotFoundException(username));
        return User.withUsername(a.getUsername())
                .password(a.getPasswordHash())
                .authorities(a.getRole().authority())
                .disabled(!a.isEnabled())
                .build();
    }
}
