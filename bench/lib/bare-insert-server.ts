/**
 * The baseline of bench/grade-saves.ts: a bare Express route doing one INSERT, with one pg Pool of
 * the API's default size, on the same database. No session, CSRF, authorization, logging or
 * scheme: what is left of a grade save when everything the product adds is taken away.
 *
 *   node --import tsx bench/lib/bare-insert-server.ts   (DATABASE_URL; POOL_MAX, default 10)
 *
 * PUT /bare/grades/{key} with the grade save's JSON body inserts one row into bench_bare (a copy of
 * the grades table made by the benchmark; `key` becomes snap_id, so every request is a new row) and
 * answers the row's id and version. Reports { type: 'ready', port } over IPC and exits when the
 * benchmark goes away.
 */
import express from 'express';
import pg from 'pg';

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: Number(process.env.POOL_MAX || 10) });
pool.on('error', () => undefined);

const app = express();
app.disable('x-powered-by');
app.use(express.json());
app.put('/bare/grades/:key', async (req, res) => {
  const b = req.body as Record<string, string | number | null>;
  // The strict rule, as the real save computes it before storing.
  const result = b.assignment !== 'right' || b.effort === 'loaf' || [b.footwork, b.hands, b.padLevel].includes('minus') ? 'minus' : 'plus';
  try {
    const { rows } = await pool.query(
      `INSERT INTO bench_bare (snap_id, player_id, grader_id, scheme_version, position, assignment, footwork, hands, pad_level, effort, result)
       VALUES ($1, 1, 1, 1, 'LT', $2, $3, $4, $5, $6, $7) RETURNING id, version`,
      [Number(req.params.key), b.assignment, b.footwork, b.hands, b.padLevel, b.effort, result],
    );
    res.json(rows[0]);
  } catch (error) {
    res.status(500).json({ error: { code: 'insert_failed', message: (error as Error).message } });
  }
});

const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  process.send?.({ type: 'ready', port: typeof address === 'object' && address ? address.port : 0 });
});
const stop = () => {
  server.close(() => void pool.end().finally(() => process.exit(0)));
  server.closeAllConnections();
};
process.on('SIGTERM', stop);
process.on('disconnect', stop);
