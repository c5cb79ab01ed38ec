import { z } from "zod";

/**
 * Named schemas of the API description: each one becomes
 * `#/components/schemas/<id>` in the OpenAPI document, so a generated client
 * gets one type per record instead of a copy per operation.
 */
export const apiComponents = z.registry<{ id: string; description?: string }>();

export function named<S extends z.ZodType>(id: string, schema: S, description?: string): S {
  apiComponents.add(schema, description ? { id, description } : { id });
  return schema;
}

/** Ids are opaque strings. */
export const id = z.string();
/** An instant: ISO 8601 in UTC (api-v1.md "Conventions"). */
export const instant = z.iso.datetime();
/** A calendar date in the shop's time zone. */
export const calendarDate = z.iso.date();
/** Money: integer cents. */
export const cents = z.number().int();
export const nullable = <S extends z.ZodType>(schema: S) => schema.nullable();

/** Every list answers a page and the cursor of the next one (null at the end). */
export const nextCursor = z.string().nullable().describe("Pass as `?cursor=` for the next page; null on the last page.");
