import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Accounts, projects, memberships, survey lines, the audit log and the session store. */
export class Foundation1764633600000 implements MigrationInterface {
  name = 'Foundation1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL UNIQUE CHECK (email = lower(email)),
        name text NOT NULL,
        password_hash text NOT NULL,
        global_role text NULL CHECK (global_role IN ('admin')),
        active boolean NOT NULL DEFAULT true,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE projects (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL,
        site text NOT NULL,
        client_organisation text NOT NULL,
        status text NOT NULL DEFAULT 'active' CHECK (status IN ('active', 'on_hold', 'closed')),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE project_members (
        project_id uuid NOT NULL REFERENCES projects(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        role text NOT NULL CHECK (role IN ('geophysicist', 'field_tech', 'lead', 'client')),
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (project_id, user_id)
      )`);
    await q.query(`CREATE INDEX project_members_user_idx ON project_members (user_id)`);
    await q.query(`
      CREATE TABLE survey_lines (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects(id) ON DELETE CASCADE,
        name text NOT NULL,
        notes text NOT NULL DEFAULT '',
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (project_id, name)
      )`);
    await q.query(`
      CREATE TABLE audit_log (
        id bigserial PRIMARY KEY,
        at timestamptz NOT NULL DEFAULT now(),
        actor_id uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        action text NOT NULL,
        object_type text NOT NULL,
        object_id text NULL,
        project_id uuid NULL REFERENCES projects(id) ON DELETE CASCADE,
        detail jsonb NOT NULL DEFAULT '{}'
      )`);
    await q.query(`CREATE INDEX audit_log_project_idx ON audit_log (project_id, at)`);
    // Session store of connect-pg-simple (its documented table layout).
    await q.query(`
      CREATE TABLE session (
        sid varchar NOT NULL PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX session_expire_idx ON session (expire)`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['session', 'audit_log', 'survey_lines', 'project_members', 'projects', 'users']) {
      await q.query(`DROP TABLE IF EXISTS ${t}`);
    }
  }
}
