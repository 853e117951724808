import { migrateDatabase, openDatabase } from "../db/client";
import { env, resolvePath } from "../lib/env";

const file = resolvePath(env().DATABASE_PATH);
const db = openDatabase(file);
migrateDatabase(db);
db.$client.close();
console.log(`Migrated ${file}`);
