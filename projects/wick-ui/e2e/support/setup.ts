// Browser journeys on a loaded 2-core machine take seconds per step; jasmine's 5 s default is for unit tests.
jasmine.DEFAULT_TIMEOUT_INTERVAL = 120_000;
