// Karma for the UI unit tests: Debian's Chromium, headless, never a downloaded browser.
process.env.CHROME_BIN ||= '/usr/bin/chromium';

module.exports = function (config) {
  config.set({
    basePath: '',
    frameworks: ['jasmine'],
    plugins: [require('karma-jasmine'), require('karma-chrome-launcher')],
    client: { jasmine: { random: true }, clearContext: true },
    browsers: ['WickChromeHeadless'],
    customLaunchers: {
      WickChromeHeadless: {
        base: 'ChromeHeadless',
        // Root in CI: Chromium refuses to start without --no-sandbox. The network flags keep it on loopback.
        flags: [
          '--no-sandbox',
          '--headless=new',
          '--disable-gpu',
          '--disable-dev-shm-usage',
          '--disable-background-networking',
          '--disable-component-update',
          '--disable-sync',
          '--no-first-run',
        ],
      },
    },
    reporters: ['progress'],
    singleRun: true,
    restartOnFileChange: false,
    browserNoActivityTimeout: 120000,
  });
};
