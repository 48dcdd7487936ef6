/**
 * Adds zod-to-openapi's `.openapi()` to zod's schemas. Imported first by the document (and the
 * registry), before any module that calls `.openapi()` while it loads.
 */
import { extendZodWithOpenApi } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";

extendZodWithOpenApi(z);
