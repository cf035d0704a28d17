// npm run verify-trail: the check of the admin page, from the command line, for
// an assessor or a scheduled job. Recomputes the keyed chain of DATABASE_URL (or
// the local install) and compares it with the anchor log (TRAIL_ANCHOR_FILE).
// Exit 0: intact; 1: not intact (the first sequence affected is printed).
import { createSequelize } from '../server/db/sequelize';
import { verifyTrail } from '../server/services/trail.service';
import { anchorFilePath, configureTrail } from '../server/services/trail-anchors';
import { resolveTarget } from './lib/backup-common';

async function main() {
  const target = await resolveTarget(process.env);
  const sequelize = createSequelize({ url: target.config.databaseUrl, poolMax: 2, queryTimeoutMs: 120_000 });
  try {
    configureTrail(target.config);
    const started = performance.now();
    const result = await verifyTrail(sequelize);
    const seconds = ((performance.now() - started) / 1000).toFixed(1);
    console.log(`Trail: ${result.entries} entries, head at sequence ${result.headSeq}; keyed from sequence ${result.keyedFromSeq}.`);
    console.log(
      `Anchors (${anchorFilePath()}): ${result.anchors.checked} checked` +
        (result.anchors.latest ? `, the latest at sequence ${result.anchors.latest.seq} (${result.anchors.latest.at}).` : '.'),
    );
    if (result.ok) {
      console.log(`Intact (checked in ${seconds} s).`);
    } else {
      console.log(`NOT INTACT from sequence ${result.firstBrokenSeq ?? '?'}: ${result.problem}`);
      if (result.anchor) console.log(`  caught by the anchor written ${result.anchor.at} (${result.anchor.reason}) at sequence ${result.anchor.seq}, hash ${result.anchor.hash}`);
      process.exitCode = 1;
    }
  } finally {
    await sequelize.close();
    await target.release();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(2);
});
