import { copyFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { and, asc, eq } from 'drizzle-orm';
import { loadConfig } from '../config';
import { campaigns, memberships, users } from '../db/schema';
import { AppError } from '../http/errors';
import { createRedward } from '../server';
import { getJobProgress } from '../services/job-progress';
import { receiveUpload, type ReceivedFile } from '../services/receive-upload';

const USAGE = 'Usage: npm run import -- --campaign <id> [--as <lead e-mail>] <folder-or-zip> [more…]';

/**
 * `npm run import`: what the upload page does, from a local folder or zip — the same service,
 * the same job runner — with progress printed. The files are copied; the folder is not touched.
 */
async function main() {
  const { values, positionals } = parseArgs({ options: { campaign: { type: 'string' }, as: { type: 'string' } }, allowPositionals: true });
  const campaignId = Number(values.campaign);
  if (!Number.isSafeInteger(campaignId) || positionals.length === 0) {
    console.error(USAGE);
    process.exit(2);
  }
  const base = loadConfig();
  const redward = await createRedward({ ...base, demo: false, mailCatcher: { ...base.mailCatcher, enabled: false } });
  const { ctx } = redward;
  try {
    const campaign = ctx.db.select().from(campaigns).where(eq(campaigns.id, campaignId)).get();
    if (!campaign) throw new Error(`There is no campaign ${campaignId}.`);
    const lead = ctx.db
      .select({ id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.campaignId, campaignId), eq(memberships.role, 'lead'), ...(values.as ? [eq(users.email, values.as.toLowerCase())] : [])))
      .orderBy(asc(memberships.id))
      .get();
    if (!lead) throw new Error(values.as ? `${values.as} is not a lead of "${campaign.name}".` : `"${campaign.name}" has no lead.`);

    const files: ReceivedFile[] = positionals.flatMap((p) => listFiles(path.resolve(p))).map((file) => {
      const tempFile = ctx.store.tempPath();
      copyFileSync(file.absolute, tempFile);
      return { originalName: file.name, tempFile };
    });
    console.log(`Importing ${files.length} file(s) into "${campaign.name}" as ${lead.email}…`);
    const receipt = await receiveUpload(ctx, ctx.store, lead, campaignId, files);
    ctx.wakeJobRunner();
    console.log(`Stored ${receipt.entries} file(s), ${(receipt.bytes / 1024 / 1024).toFixed(1)} MB; job ${receipt.jobId} queued.`);

    let lastLine = '';
    for (;;) {
      const p = getJobProgress(ctx, receipt.jobId);
      const line = `${p.state}: ${p.done}/${p.total} — stored ${p.summary.stored}, duplicates ${p.summary.duplicates}, failed ${p.summary.failed}`;
      if (line !== lastLine) console.log(line);
      lastLine = line;
      if (['done', 'failed', 'cancelled'].includes(p.state)) {
        for (const e of p.errors) console.log(`  ✗ ${e.file}: ${e.message} [${e.code}]`);
        console.log(`Linked to targets: ${p.summary.linked}; not linked: ${p.summary.unlinked}.`);
        process.exitCode = p.state === 'done' ? 0 : 1;
        break;
      }
      await new Promise((r) => setTimeout(r, 1000));
    }
  } finally {
    await redward.close();
  }
}

function listFiles(root: string, prefix = ''): { absolute: string; name: string }[] {
  const stat = statSync(root);
  const name = prefix ? `${prefix}/${path.basename(root)}` : path.basename(root);
  if (!stat.isDirectory()) return [{ absolute: root, name }];
  return readdirSync(root)
    .sort()
    .filter((entry) => !entry.startsWith('.'))
    .flatMap((entry) => listFiles(path.join(root, entry), name));
}

main().catch((err: unknown) => {
  console.error(err instanceof AppError || err instanceof Error ? err.message : err);
  process.exit(1);
});
