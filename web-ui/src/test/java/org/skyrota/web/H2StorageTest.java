package org.skyrota.web;

import org.springframework.boot.data.jpa.test.autoconfigure.DataJpaTest;
import org.springframework.context.annotation.Import;
import org.skyrota.web.support.TransactionsConfig;

/** The storage contract on the embedded database (H2, as in a default installation). */
@DataJpaTest
@Import(TransactionsConfig.class)
class H2StorageTest extends StorageContractTest {}
