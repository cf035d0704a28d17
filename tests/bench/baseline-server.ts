// The baseline: the same findings list query answered by node:http and the
// mariadb driver's pool directly — no framework, no session, no authorization,
// no ORM. What the database and Node can do; Whorl's list is measured against it.
import http from 'node:http';
import mariadb from 'mariadb';

const url = new URL(process.env.DATABASE_URL!);
const pool = mariadb.createPool({
  host: url.hostname,
  port: Number(url.port),
  user: decodeURIComponent(url.username),
  password: decodeURIComponent(url.password),
  database: url.pathname.slice(1),
  connectionLimit: Number(process.env.DATABASE_POOL_MAX ?? 20),
  timezone: 'Z',
});

// The rows Whorl's list shows: the finding, its author, area, audit and corrective action with its owner.
const LIST_SQL = `
  SELECT f.id, f.number, f.title, f.state, f.version, f.class, f.rule, f.requirement, f.objective_evidence, f.due_date,
         f.containment, f.containment_due_date, f.created_at, f.updated_at, f.audit_id, f.technique_id, f.technique_code,
         f.area_id, ar.name AS area_name, au.title AS audit_title, u.id AS author_id, u.display_name AS author_name,
         ca.id AS action_id, ca.number AS action_number, ca.state AS action_state, ca.due_date AS action_due_date,
         o.id AS owner_id, o.display_name AS owner_name
    FROM findings f
    LEFT JOIN users u ON u.id = f.author_id
    LEFT JOIN areas ar ON ar.id = f.area_id
    LEFT JOIN audits au ON au.id = f.audit_id
    LEFT JOIN corrective_actions ca ON ca.finding_id = f.id
    LEFT JOIN users o ON o.id = ca.owner_id
   WHERE f.state = ?
   ORDER BY f.number DESC, f.id DESC
   LIMIT ? OFFSET ?`;

const server = http.createServer(async (req, res) => {
  try {
    const requestUrl = new URL(req.url ?? '/', 'http://baseline');
    if (requestUrl.pathname !== '/findings') {
      res.writeHead(404).end();
      return;
    }
    const state = requestUrl.searchParams.get('state') ?? 'action_open';
    const pageSize = Math.min(200, Number(requestUrl.searchParams.get('pageSize') ?? 50));
    const page = Math.max(1, Number(requestUrl.searchParams.get('page') ?? 1));
    const [rows, total] = await Promise.all([
      pool.query({ sql: LIST_SQL, dateStrings: false }, [state, pageSize, (page - 1) * pageSize]),
      pool.query('SELECT COUNT(*) AS n FROM findings WHERE state = ?', [state]),
    ]);
    const items = (rows as Record<string, unknown>[]).map((row) => ({ ...row }));
    const body = JSON.stringify({ items, total: Number((total as { n: bigint | number }[])[0].n) });
    res.writeHead(200, { 'content-type': 'application/json; charset=utf-8', 'content-length': Buffer.byteLength(body) });
    res.end(body);
  } catch (error) {
    console.error(error);
    res.writeHead(500).end();
  }
});

server.listen(Number(process.env.PORT), '127.0.0.1', () => console.log(`baseline listening on ${process.env.PORT}`));
process.on('SIGTERM', () => {
  server.close();
  void pool.end().then(() => process.exit(0));
});
