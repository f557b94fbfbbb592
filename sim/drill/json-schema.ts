/**
 * JSON Schema of the drill format, generated from the zod definition (zod 4 z.toJSONSchema,
 * draft 2020-12) for the input side (what an author writes: defaulted fields are optional).
 * The committed copy is sim/drill/drill.schema.json; `npm run sim -- schema --out <file>` writes
 * it, and a test fails when it is stale. Cross-field rules (refinements) are not expressible in
 * JSON Schema and are listed in README.md.
 */
import { z } from "zod";
import { drillSchema, DRILL_FORMAT_VERSION } from "./schema";

export function drillJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(drillSchema, { io: "input", unrepresentable: "any" }) as Record<string, unknown>;
  return {
    $id: `https://loopwright.example/schemas/drill-v${DRILL_FORMAT_VERSION}.json`,
    title: "Loopwright drill",
    description: `Loopwright drill document, formatVersion ${DRILL_FORMAT_VERSION}`,
    ...schema,
  };
}

export function drillJsonSchemaText(): string {
  return JSON.stringify(drillJsonSchema(), null, 2) + "\n";
}
