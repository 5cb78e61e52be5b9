// Command line door to the check contract (METHODS.md §9), no database needed: npm run --silent soa -- check
// < request.json > response.json Exit 0 with the response on stdout; exit 2 with { "error": { "path",
// "message" } } on stdout for invalid input, or with the usage on stderr for an unknown subcommand; exit 1 if
// the engine itself fails. Never a stack trace.
import { handleCheckText } from "../src/lib/soa/contract";

const USAGE = `usage: npm run --silent soa -- check < request.json > response.json

  check   read a check request (JSON) from stdin, print the response (JSON) to stdout
          exit 0: checked; exit 2: invalid request (the error names the field path)`;

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin)
    chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : chunk);
  return Buffer.concat(chunks).toString("utf8");
}

async function main(args: string[]): Promise<number> {
  const [command, ...rest] = args;
  if (command !== "check" || rest.length > 0) {
    process.stderr.write(
      `${command === undefined ? "missing subcommand" : `unknown arguments: ${args.join(" ")}`}\n${USAGE}\n`,
    );
    return 2;
  }
  const outcome = handleCheckText(await readStdin());
  process.stdout.write(`${JSON.stringify(outcome.body, null, 2)}\n`);
  return outcome.status === 200 ? 0 : 2;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    const reason = error instanceof Error ? error.message : String(error);
    process.stderr.write(`soa: internal error: ${reason}\n`);
    process.exitCode = 1;
  },
);
