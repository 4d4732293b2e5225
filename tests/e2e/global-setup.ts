import bcrypt from "bcryptjs";
import pg from "pg";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";

/** Puts one account per role into the test database; the test run's database is created fresh by scripts/test.sh. */
export default async function globalSetup(): Promise<void> {
  const url = process.env.DATABASE_URL ?? "";
  if (!/_test(\?|$)/.test(url)) throw new Error("End-to-end tests need DATABASE_URL to name a *_test database (run `npm test`).");
  const pool = new pg.Pool({ connectionString: url });
  const hash = await bcrypt.hash(E2E_PASSWORD, 10);
  try {
    for (const [role, person] of Object.entries(E2E_PEOPLE)) {
      await pool.query(
        `insert into users (email, name, roles, password_hash) values ($1, $2, $3::role[], $4)
         on conflict (email) do update set roles = excluded.roles, password_hash = excluded.password_hash, active = true`,
        [person.email, person.name, [role], hash],
      );
    }
    await pool.query("delete from sign_in_attempts where email like 'e2e-%'");
  } finally {
    await pool.end();
  }
}
