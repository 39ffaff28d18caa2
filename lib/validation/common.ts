// Small schemas that many routes and guards share.
import { z } from "zod";

/** An id in a path or query (a PostgreSQL uuid); anything else is treated as not found. */
export const uuidSchema = z.uuid();
