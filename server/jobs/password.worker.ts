/** bcrypt on the CPU pool: a hash or compare at cost 12 is a quarter of a second of CPU (bcryptjs is pure JS). */
import bcrypt from "bcryptjs";
import { workerTask } from "./worker-task";

export type PasswordTask =
  | { op: "hash"; password: string; cost: number }
  | { op: "compare"; password: string; hash: string };

export default workerTask<PasswordTask, string | boolean>((t) =>
  t.op === "hash" ? bcrypt.hash(t.password, t.cost) : bcrypt.compare(t.password, t.hash),
);
