/** A fresh SQLite file in a temp folder, migrated the same way as production. */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { migrateSqlite } from "../../lib/db/migrate";
import { createClient, type Db } from "../../lib/db/client";

export interface TempDb {
  url: string;
  file: string;
  dir: string;
  client: Db;
  cleanup: () => Promise<void>;
}

export function tempDb(): TempDb {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-test-"));
  const file = path.join(dir, "test.db");
  const url = `file:${file}`;
  migrateSqlite({ databaseUrl: url });
  const client = createClient(url);
  return {
    url,
    file,
    dir,
    client,
    cleanup: async () => {
      await client.$disconnect();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
