/**
 * The bench scripts' command line: positional arguments, `--name value` options taken out of them,
 * and a failure that prints the usage and exits with status 2.
 */
export function cliArgs(label: string, usage: string) {
  const args = process.argv.slice(2);
  const fail = (message: string): never => {
    console.error(`${label}: ${message}\n${usage}`);
    process.exit(2);
  };
  const option = (name: string): string | undefined => {
    const k = args.indexOf(name);
    if (k < 0) return undefined;
    const v = args[k + 1];
    if (v === undefined) fail(`${name} needs a value`);
    args.splice(k, 2);
    return v;
  };
  return { args, option, fail };
}
