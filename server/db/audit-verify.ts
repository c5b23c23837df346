// `npm run audit:verify`: recomputes every audit chain and names the first broken link.
import { loadConfig } from '../config';
import { allChains, verifyChain } from '../services/audit';
import { openRoleConnection } from './roles';

const config = loadConfig();
const sequelize = openRoleConnection(config.databaseUrl);
try {
  const chains = await allChains(sequelize);
  let broken = 0;
  let checked = 0;
  for (const chain of chains) {
    const result = await verifyChain(chain, sequelize);
    checked += result.checked;
    const label = chain === 'account' ? 'account events' : `workspace ${chain}`;
    if (result.ok) {
      console.log(`ok      ${label}: ${result.checked} rows`);
    } else {
      broken += 1;
      const link = result.firstBroken!;
      console.log(
        `BROKEN  ${label}: first broken link at row ${link.position} (id ${link.id}, written ${link.at}): ${link.reason}`,
      );
    }
  }
  console.log(
    broken === 0
      ? `The audit trail is intact: ${checked} rows in ${chains.length} chains.`
      : `${broken} of ${chains.length} chains are broken.`,
  );
  process.exitCode = broken === 0 ? 0 : 1;
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 2;
} finally {
  await sequelize.close();
}
