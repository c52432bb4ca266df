// The version people see in `rigbook --version`: the package's own, read at build time (the
// bundler inlines the one field), so it cannot drift from what was released.
import packageJson from '../../package.json';

export const RIGBOOK_VERSION: string = packageJson.version;
