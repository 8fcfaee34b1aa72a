/**
 * The floor: a bare Express app that does each benchmarked route's SQL through a pg pool of the
 * same size as the app's (DB_POOL_MAX), with no session, no ORM, no logging, no validation beyond
 * JSON parsing. What the real route costs above this is the price of everything else (signing the
 * request in, the ORM, the framework around it). Run by bench/api.ts in its own process:
 * `node --import tsx bench/lib/floor-server.ts` with DATABASE_URL, PORT and DB_POOL_MAX set.
 */
import express from 'express';
import pg from 'pg';
import { homeLoad, type HomeInput, type Room } from '@calc';
import { verifyPassword } from '../../server/src/services/passwords';

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: Number(process.env.DB_POOL_MAX ?? 10) });
const app = express();
app.disable('x-powered-by');
app.use(express.json({ limit: '256kb' }));

const JOB_COLUMNS = `j.id, j.status, j.street, j.unit, j.city, j.region, j.postal_code, j.notes, j.design_conditions,
  j.design_sources, j.tightness, j.version, j.created_at, j.updated_at, j.last_activity_at,
  c.id as customer_id, c.name as customer_name, s.id as salesperson_id, s.name as salesperson_name,
  i.id as installer_id, i.name as installer_name`;
const JOB_FROM = `from job j join customer c on c.id = j.customer_id join app_user s on s.id = j.salesperson_id
  left join app_user i on i.id = j.assigned_installer_id`;

type Row = Record<string, unknown>;
const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : d);
const jobJson = (r: Row) => ({
  id: r.id,
  status: r.status,
  customer: { id: r.customer_id, name: r.customer_name },
  site: { street: r.street, unit: r.unit, city: r.city, region: r.region, postalCode: r.postal_code },
  salesperson: { id: r.salesperson_id, name: r.salesperson_name },
  assignedInstaller: r.installer_id ? { id: r.installer_id, name: r.installer_name } : null,
  notes: r.notes,
  designConditions: r.design_conditions,
  designSources: r.design_sources,
  tightness: r.tightness,
  version: r.version,
  createdAt: iso(r.created_at),
  updatedAt: iso(r.updated_at),
  lastActivityAt: iso(r.last_activity_at),
});
const companyOf = (q: unknown) => String((q as { company?: string }).company ?? '');

app.get('/floor/jobs', async (req, res) => {
  const { rows } = await pool.query(
    `select ${JOB_COLUMNS}, count(*) over () as total ${JOB_FROM} where j.company_id = $1
     order by j.last_activity_at desc, j.id asc limit 25 offset 0`,
    [companyOf(req.query)],
  );
  res.json({ items: rows.map(jobJson), total: Number(rows[0]?.total ?? 0), page: 1, pageSize: 25 });
});

async function jobRow(company: string, id: string): Promise<Row | undefined> {
  const { rows } = await pool.query(`select ${JOB_COLUMNS} ${JOB_FROM} where j.company_id = $1 and j.id = $2`, [
    company,
    id,
  ]);
  return rows[0];
}

app.get('/floor/jobs/:id/rooms', async (req, res) => {
  const job = await jobRow(companyOf(req.query), req.params.id);
  if (!job) return void res.status(404).end();
  const rooms = await pool.query(
    `select id, position, input, version, created_at, updated_at from room where job_id = $1
     order by position, created_at, id`,
    [job.id],
  );
  const photos = await pool.query(
    `select p.id, p.room_id, p.content_type, p.byte_size, p.width, p.height, p.original_name, p.created_at
     from photo p join room r on r.id = p.room_id where r.job_id = $1 order by p.created_at, p.id`,
    [job.id],
  );
  res.json({
    rooms: rooms.rows.map((r: Row) => ({
      id: r.id,
      jobId: job.id,
      position: r.position,
      input: r.input,
      version: r.version,
      createdAt: iso(r.created_at),
      updatedAt: iso(r.updated_at),
      photos: photos.rows.filter((p: Row) => p.room_id === r.id),
    })),
  });
});

app.get('/floor/jobs/:id/loads', async (req, res) => {
  const job = await jobRow(companyOf(req.query), req.params.id);
  if (!job) return void res.status(404).end();
  const rooms = await pool.query(`select input from room where job_id = $1 order by position, created_at, id`, [
    job.id,
  ]);
  const home = {
    id: job.id,
    designConditions: job.design_conditions,
    tightness: job.tightness,
    rooms: rooms.rows.map((r: { input: Room }) => r.input),
  } as HomeInput;
  res.json({ jobId: job.id, jobVersion: job.version, loads: homeLoad({ home }) });
});

app.patch('/floor/jobs/:jobId/rooms/:roomId', async (req, res) => {
  const version = Number(/^"(\d+)"$/.exec(req.get('if-match') ?? '')?.[1]);
  const client = await pool.connect();
  try {
    await client.query('begin');
    const { rows } = await client.query(
      `update room set input = $1, version = version + 1, updated_at = now()
       where id = $2 and job_id = $3 and version = $4 returning id, position, input, version, created_at, updated_at`,
      [JSON.stringify({ ...req.body.input, id: req.params.roomId }), req.params.roomId, req.params.jobId, version],
    );
    await client.query('update job set last_activity_at = now() where id = $1', [req.params.jobId]);
    await client.query('commit');
    const r = rows[0] as Row | undefined;
    if (!r) return void res.status(409).end();
    res.setHeader('ETag', `"${String(r.version)}"`);
    res.json({ room: { ...r, createdAt: iso(r.created_at), updatedAt: iso(r.updated_at), photos: [] } });
  } catch (e) {
    await client.query('rollback');
    throw e;
  } finally {
    client.release();
  }
});

app.post('/floor/login', async (req, res) => {
  const { rows } = await pool.query('select id, name, role, password_hash from app_user where email = $1', [
    String(req.body.email),
  ]);
  const user = rows[0] as { id: string; name: string; role: string; password_hash: string } | undefined;
  if (!user || !(await verifyPassword(user.password_hash, String(req.body.password))))
    return void res.status(401).end();
  res.json({ user: { id: user.id, name: user.name, role: user.role } });
});

const server = app.listen(Number(process.env.PORT), '127.0.0.1', () => console.log('floor listening'));
process.on('SIGTERM', () => {
  server.close();
  server.closeAllConnections();
  void pool.end().then(() => process.exit(0));
});
