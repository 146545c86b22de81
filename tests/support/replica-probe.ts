// Run by tests/integration/read-replicas.test.ts with tsx --conditions=react-server (lib/server is
// server-only): builds the app's Sequelize with a "replica" address and prints, as JSON, which
// database each kind of query reached.
import { QueryTypes } from 'sequelize';
import { FROM_REPLICA, createSequelize } from '../../lib/server/db';

const [primary, replica] = process.argv.slice(2);
const sequelize = createSequelize(primary, [replica], 2);
const where = async (options: Record<string, unknown>) =>
  (
    (await sequelize.query('select current_database() as db', { type: QueryTypes.SELECT, ...options })) as {
      db: string;
    }[]
  )[0].db;

async function main() {
  const out = {
    plainSelect: await where({}),
    fromReplica: await where(FROM_REPLICA),
    rawQuery: ((await sequelize.query('select current_database() as db'))[0] as { db: string }[])[0].db,
    inTransaction: await sequelize.transaction(async (transaction) => where({ ...FROM_REPLICA, transaction })),
  };
  await sequelize.close();
  console.log(JSON.stringify(out));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
