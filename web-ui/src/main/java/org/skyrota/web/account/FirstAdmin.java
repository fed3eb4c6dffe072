package org.skyrota.web.account;

import java.security.SecureRandom;
import java.util.Base64;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * Makes sure a fresh installation can be administered: when there is no account at all (after
 * the demo data, which brings its own, had its turn), it creates {@code admin} with the password
 * from {@code SKYROTA_ADMIN_PASSWORD}, or with a generated one that is printed once to the log.
 */
@Component
@Order(20)
class FirstAdmin implements ApplicationRunner {

    private static final Logger log = LoggerFactory.getLogger(FirstAdmin.class);

    private final AccountRepository accounts;
    private final PasswordEncoder encoder;
    private final String configuredPassword;

    FirstAdmin(AccountRepository accounts, PasswordEncoder encoder,
               @Value("${SKYROTA_ADMIN_PASSWORD:${skyrota.admin-password:}}") String configuredPassword) {
        this.accounts = accounts;
        this.encoder = encoder;
        this.configuredPassword = configuredPassword;
    }

    @Override
    @Transactional
    public void run(ApplicationArguments args) {
        if (accounts.count() > 0) {
            return;
        }
        boolean generated = configuredPassword == null || configuredPassword.isBlank();
        String password = generated ? generatePassword() : configuredPassword;
        accounts.save(new Account("admin", encoder.encode(password), Role.ADMIN));
        if (generated) {
            log.warn("\n\n  Created the first account: admin / {}\n  This password is shown once; change it, "
                    + "or set SKYROTA_ADMIN_PASSWORD before the first start.\n", password);
        } else {
            log.info("Created the first account 'admin' with the password from SKYROTA_ADMIN_PASSWORD");
        }
    }

    private static String generatePassword() {
        byte[] bytes = new byte[18];
        new SecureRandom().nextBytes(bytes);
        return Base64.getUrlEncoder().withoutPadding().encodeToString(bytes);
    }
}
