import { sql } from 'drizzle-orm'
import { check, jsonb, pgTable, smallint, text, timestamp } from 'drizzle-orm/pg-core'
import type { AreaGeometry, Place } from '../../../shared/schemas/region'

/**
 * The region the service covers: at most one row (id 1). Geometries are GeoJSON, checked with
 * shared/schemas/region.ts before every write; the CHECKs below only keep the jsonb's shape.
 * Without a row the product still works: the report form asks for latitude and longitude.
 */
export const region = pgTable(
  'region',
  {
    id: smallint('id').primaryKey().default(1),
    name: text('name').notNull(),
    /** The region's boundary (Polygon or MultiPolygon); the map frames it. */
    outline: jsonb('outline').$type<AreaGeometry>().notNull(),
    /** The land (Polygon or MultiPolygon); its edges are the coastline. */
    coast: jsonb('coast').$type<AreaGeometry>().notNull(),
    /** Names written on the map. */
    places: jsonb('places').$type<Place[]>().notNull().default(sql`'[]'::jsonb`),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('region_single_row', sql`${t.id} = 1`),
    check('region_outline_area', sql`${t.outline}->>'type' in ('Polygon', 'MultiPolygon')`),
    check('region_coast_area', sql`${t.coast}->>'type' in ('Polygon', 'MultiPolygon')`),
    check('region_places_array', sql`jsonb_typeof(${t.places}) = 'array'`),
  ],
)

export type Region = typeof region.$inferSelect
