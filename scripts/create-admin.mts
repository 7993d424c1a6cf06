// Creates the first administrator of a production installation (no demo data):
//   npm run admin:create -- --email ada@company.example --name "Ada Brennan"
// The password is read from standard input (one line) so it stays out of the shell history;
// on a terminal it is asked for without echo.
import { parseArgs } from "node:util";
import { createInterface } from "node:readline";
import { closeDb } from "../db/index.ts";
import { parseOrThrow } from "../lib/validation.ts";
import { createFirstAdmin } from "../lib/users/first-admin.ts";
import { firstAdminSchema } from "../lib/users/schemas.ts";

const { values } = parseArgs({ options: { email: { type: "string" }, name: { type: "string" } } });

async function readPassword(): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: process.stdin.isTTY });
  if (process.stdin.isTTY) {
    process.stdout.write("Password for the administrator (at least 10 characters): ");
    // Hide what is typed: readline echoes through _writeToOutput.
    (rl as unknown as { _writeToOutput: (s: string) => void })._writeToOutput = () => undefined;
  }
  const line = await new Promise<string>((resolve) => rl.once("line", resolve).once("close", () => resolve("")));
  rl.close();
  if (process.stdin.isTTY) process.stdout.write("\n");
  return line;
}

try {
  const input = parseOrThrow(firstAdminSchema, { email: values.email, name: values.name, password: await readPassword() });
  const { id } = await createFirstAdmin(input);
  console.log(`administrator created: ${input.email} (${id})`);
} catch (error) {
  // lib/ is loaded through the "@/" alias here, so compare by name rather than instanceof.
  console.error((error as Error).name === "AppError" ? (error as Error).message : error);
  process.exitCode = 1;
} finally {
  await closeDb();
}
