/**
 * The command line by its former name: runs scripts/cli.cjs (what `npm run -s cli` runs), which holds the
 * launcher. Prefer `node scripts/cli.cjs`: an ES module entry costs a small call node's ES module loader.
 */
import './cli.cjs';
