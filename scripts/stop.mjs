// `npm run stop`: stops every service `npm start` or `npm test` started, then PostgreSQL.
import { serviceNames, stopService, stopPostgres, log } from "./stack.mjs";

for (const name of serviceNames()) {
  log(`stopping ${name}…`);
  await stopService(name);
}
stopPostgres();
log("stopped.");
