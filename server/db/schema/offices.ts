import { sql } from 'drizzle-orm'
import { check, doublePrecision, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import type { AreaGeometry } from '../../../shared/schemas/region'

/** A field office. Reports are routed to the office whose area holds the place, else the nearest (shared/domain/office-areas.ts). */
export const offices = pgTable(
  'offices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    name: text('name').notNull().unique(),
    regionName: text('region_name').notNull(),
    /** Postal address ('' when not given). */
    address: text('address').notNull().default(''),
    centreLatDeg: doublePrecision('centre_lat_deg').notNull(),
    centreLonDeg: doublePrecision('centre_lon_deg').notNull(),
    /** The office's area on the map (GeoJSON Polygon or MultiPolygon, shared/schemas/region.ts); none yet: null. */
    area: jsonb('area').$type<AreaGeometry>(),
    /** First-response targets per priority, in hours (office-configurable; shared/domain/case-clocks.ts). */
    firstResponseP1Hours: integer('first_response_p1_hours').notNull().default(1),
    firstResponseP2Hours: integer('first_response_p2_hours').notNull().default(8),
    firstResponseP3Hours: integer('first_response_p3_hours').notNull().default(24),
    firstResponseP4Hours: integer('first_response_p4_hours').notNull().default(72),
    /** Resolution (closing) targets per priority, in hours (office-configurable). */
    targetP1Hours: integer('target_p1_hours').notNull().default(4),
    targetP2Hours: integer('target_p2_hours').notNull().default(24),
    targetP3Hours: integer('target_p3_hours').notNull().default(72),
    targetP4Hours: integer('target_p4_hours').notNull().default(240),
    /** The office's IANA time zone: its "today", "next 24 hours" and daily digest follow it (checked in the app with Intl). */
    timeZone: text('time_zone').notNull().default('UTC'),
    /** Months a closed case keeps its complainant's personal data and evidence (shared/domain/retention.ts). */
    retentionMonths: integer('retention_months').notNull().default(24),
    /** Optimistic version of the office's details and area: an edit names the version it read. */
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('offices_lat_range', sql`${t.centreLatDeg} between -90 and 90`),
    check('offices_lon_range', sql`${t.centreLonDeg} between -180 and 180`),
    check('offices_area_polygon', sql`${t.area} is null or ${t.area}->>'type' in ('Polygon', 'MultiPolygon')`),
    check('offices_time_zone_shape', sql`${t.timeZone} ~ '^[A-Za-z_]+(/[A-Za-z0-9_+-]+)*$'`),
    check('offices_first_response_targets_positive', sql`least(${t.firstResponseP1Hours}, ${t.firstResponseP2Hours}, ${t.firstResponseP3Hours}, ${t.firstResponseP4Hours}) > 0`),
    check('offices_retention_months_range', sql`${t.retentionMonths} between 1 and 1200`),
    check('offices_targets_positive', sql`least(${t.targetP1Hours}, ${t.targetP2Hours}, ${t.targetP3Hours}, ${t.targetP4Hours}) > 0`),
  ],
)

export type Office = typeof offices.$inferSelect
