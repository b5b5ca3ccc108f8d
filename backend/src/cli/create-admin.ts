import { createInterface } from 'node:readline/promises';
import { loadConfig } from '../config';
import { openDatabase } from '../db/client';
import { AppError } from '../http/errors';
import { createAdminAccount } from '../services/create-admin-account';

/**
 * `npm run create-admin -- <email> <name>`: adds an installation admin. The password is read
 * from standard input (typed twice at a terminal, or piped once), never from the command line
 * where it would end up in the shell history.
 */
async function main() {
  const [email, ...nameParts] = process.argv.slice(2);
  if (!email || nameParts.length === 0) {
    console.error('Usage: npm run create-admin -- <email> <full name>');
    process.exit(2);
  }
  const password = await readPassword();
  const config = loadConfig();
  const db = openDatabase(config.databasePath);
  try {
    const id = await createAdminAccount({ db }, email, nameParts.join(' '), password);
    console.log(`Admin account ${id} created for ${email}.`);
  } finally {
    db.$client.close();
  }
}

async function readPassword(): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: process.stdin.isTTY });
  // Show the prompts but not what is typed after them.
  const internals = rl as unknown as { _writeToOutput(s: string): void; output: NodeJS.WritableStream };
  let muted = false;
  internals._writeToOutput = (s: string) => {
    if (!muted) internals.output.write(s);
    else if (s.includes('\n')) internals.output.write('\n');
  };
  const ask = async (prompt: string) => {
    const answer = rl.question(prompt);
    muted = process.stdin.isTTY === true;
    try {
      return await answer;
    } finally {
      muted = false;
    }
  };
  try {
    const first = await ask('Password (at least 10 characters): ');
    if (!process.stdin.isTTY) return first;
    const second = await ask('Repeat the password: ');
    if (first !== second) throw new AppError(400, 'mismatch', 'The two passwords differ.');
    return first;
  } finally {
    rl.close();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
