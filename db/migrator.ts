// Runs the dated migrations in /migrations. Kysely's FileMigrationProvider imports from inside
// node_modules, which fails under vitest for .ts files, so this provider imports each file itself.
import fs from "node:fs/promises";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { type Kysely, type Migration, type MigrationProvider, Migrator } from "kysely";

export const migrationsFolder = path.resolve(import.meta.dirname, "..", "migrations");

class FolderMigrationProvider implements MigrationProvider {
  constructor(private folder: string) {}
  async getMigrations(): Promise<Record<string, Migration>> {
    const files = (await fs.readdir(this.folder)).filter((f) => /\.(ts|js|mjs)$/.test(f)).sort();
    const migrations: Record<string, Migration> = {};
    for (const file of files) {
      const mod = await import(pathToFileURL(path.join(this.folder, file)).href);
      migrations[file.replace(/\.(ts|js|mjs)$/, "")] = { up: mod.up, down: mod.down };
    }
    return migrations;
  }
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function migrator(db: Kysely<any>): Migrator {
  // Unordered: work merged from parallel branches can bring a migration whose name sorts before one a
  // developer's database already ran; it is then run next instead of refusing the whole database.
  return new Migrator({ db, provider: new FolderMigrationProvider(migrationsFolder), allowUnorderedMigrations: true });
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const { error, results } = await migrator(db).migrateToLatest();
  for (const r of results ?? []) {
    if (r.status === "Error") console.error(`migration ${r.migrationName} failed`);
  }
  if (error) throw error;
  return (results ?? []).map((r) => r.migrationName);
}
