// Jasmine helper for the server suite: one Sequelize against the freshly migrated test database.

jasmine.DEFAULT_TIMEOUT_INTERVAL = 20_000;
