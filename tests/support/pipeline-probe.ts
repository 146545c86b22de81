// Run by tests/integration/prepared-pipeline.test.ts with tsx --conditions=react-server (lib/server is
// server-only), with DB_POOL_MAX=1 so every call below shares one pooled connection: runs pipelined
// transactions against a scratch table and prints, as JSON, what each one returned or threw and what
// the table held afterwards.
import { QueryTypes } from 'sequelize';
import { getDb } from '../../lib/server/db';
import { preparedPipeline } from '../../lib/server/db/prepared-query';

const table = `pipeline_probe_${process.pid}`;
const insert = (id: number) => ({
  name: 'probe:insert',
  sql: `insert into ${table} (id) values (:id) returning id`,
  values: { id },
});
const count = { name: 'probe:count', sql: `select count(*)::int as n from ${table}`, values: {} };

async function ids(): Promise<number[]> {
  const rows = await getDb().sequelize.query<{ id: number }>(`select id from ${table} order by id`, {
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => r.id);
}

async function failure(steps: Parameters<typeof preparedPipeline>[0]) {
  try {
    await preparedPipeline(steps);
    return null;
  } catch (err) {
    const e = err as Error & { parent?: { code?: string } };
    return { code: e.parent?.code ?? null };
  }
}

async function main() {
  const { sequelize } = getDb();
  await sequelize.query(`create table ${table} (id int primary key)`);
  try {
    const first = await preparedPipeline([insert(1), count]);
    const secondFails = await failure([insert(2), insert(1)]);
    const afterSecondFails = await ids();
    const firstFails = await failure([insert(1), insert(3)]);
    const afterFirstFails = await ids();
    // A statement without one of its values is refused before anything is sent: no BEGIN is left open on the
    // pooled connection (inside a transaction block, now() is the block's start, not this statement's).
    const unbound = await failure([{ ...insert(5), values: {} }]);
    const [{ outside }] = await sequelize.query<{ outside: boolean }>(
      'select now() = statement_timestamp() as outside',
      {
        type: QueryTypes.SELECT,
      },
    );
    const again = await preparedPipeline([insert(4), count]);
    const plainQueryAfter = (await sequelize.query('select 1 as one', { type: QueryTypes.SELECT }))[0];
    console.log(
      JSON.stringify({
        first,
        secondFails,
        afterSecondFails,
        firstFails,
        afterFirstFails,
        unbound,
        outside,
        again,
        plainQueryAfter,
      }),
    );
  } finally {
    await sequelize.query(`drop table if exists ${table}`);
    await sequelize.close();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
