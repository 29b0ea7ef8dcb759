/**
 * How the browser tests and the page bench launch Debian's chromium (scripts/ensure-chromium.sh installs it): on a
 * closed network with no background fetches, and with no sandbox because CI runs as root.
 */
export const CHROMIUM_LAUNCH = {
  executablePath: '/usr/bin/chromium',
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
  ],
};
