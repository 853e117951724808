/** `npm run test:e2e:prepare`: seeds the end-to-end database, so one spec can be run alone with `npx playwright test tests/e2e/<spec>`. */
import { prepareE2eDatabase } from "./lib/e2e-database";
import { ensureSecrets } from "./lib/ensure-secret";

ensureSecrets();
prepareE2eDatabase().catch((error) => {
  console.error(error);
  process.exit(1);
});
