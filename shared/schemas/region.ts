/**
 * The region the service covers, as GeoJSON (RFC 7946: positions are [longitude, latitude] in
 * degrees, WGS 84): its outline, its coast (the land, whose edges are the coastline), named
 * places, and each field office's point and area. Stored as jsonb and checked with these
 * schemas on write; the public map endpoint answers a FeatureCollection of them.
 */
import { z } from 'zod'
import { GeoJSON2DMultiPolygonSchema, GeoJSON2DPointSchema, GeoJSON2DPolygonSchema } from 'zod-geojson'

/** Every position of a geometry, whatever its nesting. */
function positionsOf(coordinates: unknown): [number, number][] {
  if (!Array.isArray(coordinates)) return []
  if (typeof coordinates[0] === 'number') return [coordinates as [number, number]]
  return coordinates.flatMap(positionsOf)
}

const onTheGlobe = (g: { coordinates: unknown }) => positionsOf(g.coordinates).every(([lon, lat]) => Math.abs(lon) <= 180 && Math.abs(lat) <= 90)
const notEmpty = (g: { coordinates: unknown }) => positionsOf(g.coordinates).length > 0
const RANGE = { message: 'Positions are [longitude, latitude] in degrees: longitude −180 to 180, latitude −90 to 90.' }
const EMPTY = { message: 'The geometry has no positions.' }

export const pointSchema = GeoJSON2DPointSchema.refine(onTheGlobe, RANGE)
export type PointGeometry = z.infer<typeof pointSchema>

/** An area: a Polygon or a MultiPolygon with at least one position. */
export const areaSchema = z
  .discriminatedUnion('type', [GeoJSON2DPolygonSchema, GeoJSON2DMultiPolygonSchema], { message: 'An area is a GeoJSON Polygon or MultiPolygon.' })
  .refine(notEmpty, EMPTY)
  .refine(onTheGlobe, RANGE)
  .meta({ id: 'Area', description: 'A GeoJSON (RFC 7946) Polygon or MultiPolygon: positions are [longitude, latitude] in degrees, WGS 84.' })
export type AreaGeometry = z.infer<typeof areaSchema>

export const PLACE_KINDS = ['town', 'land', 'sea'] as const
export type PlaceKind = (typeof PLACE_KINDS)[number]

/** A name written on the map: a town (with a dot), a stretch of land or a sea (in italics). */
export const placeSchema = z.object({
  name: z.string().trim().min(1).max(80),
  kind: z.enum(PLACE_KINDS),
  point: pointSchema,
})
export type Place = z.infer<typeof placeSchema>

/** What is stored for the region (one row): checked before every write. */
export const regionSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the region a name.' }).max(120),
  /** The region's boundary; the map frames it. */
  outline: areaSchema,
  /** The land inside (and around) the region; the sea is whatever lies outside it. */
  coast: areaSchema,
  places: z.array(placeSchema).max(200),
})
export type RegionInput = z.infer<typeof regionSchema>

/** GET /api/region: one Feature per part, told apart by properties.kind. */
const feature = <G extends z.ZodType, P extends z.ZodType>(geometry: G, properties: P) =>
  z.object({ type: z.literal('Feature'), geometry, properties })

export const regionOutlineFeatureSchema = feature(areaSchema, z.object({ kind: z.literal('region'), name: z.string() }).strict())
export const coastFeatureSchema = feature(areaSchema, z.object({ kind: z.literal('coast') }).strict())
export const placeFeatureSchema = feature(pointSchema, z.object({ kind: z.literal('place'), name: z.string(), placeKind: z.enum(PLACE_KINDS) }).strict())
/** An office's point (where reports are routed from while it has no area). Public: name only. */
export const officePointFeatureSchema = feature(pointSchema, z.object({ kind: z.literal('office'), name: z.string() }).strict())
export const officeAreaFeatureSchema = feature(areaSchema, z.object({ kind: z.literal('office_area'), name: z.string() }).strict())

export const regionFeatureSchema = z.union([regionOutlineFeatureSchema, coastFeatureSchema, placeFeatureSchema, officePointFeatureSchema, officeAreaFeatureSchema])
export type RegionFeature = z.infer<typeof regionFeatureSchema>

/**
 * What the map is drawn on: a tile server's URL template ({z}/{x}/{y}) and its attribution
 * (plain text) when the server is configured with one, or the offline basemap drawn from this
 * answer's own features, so nothing leaves the service.
 */
export const basemapSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('offline') }).strict(),
  z.object({ kind: z.literal('tiles'), urlTemplate: z.string().min(1), attribution: z.string().min(1) }).strict(),
])
export type Basemap = z.infer<typeof basemapSchema>
export const OFFLINE_BASEMAP: Basemap = { kind: 'offline' }

/**
 * The region map. Without a configured region it holds only the offices (and the web shows
 * no map); the strict property objects keep anything else (staff, targets) out of it.
 * `basemap` is a foreign member of the FeatureCollection (RFC 7946 §6.1).
 */
export const regionMapSchema = z.object({ type: z.literal('FeatureCollection'), features: z.array(regionFeatureSchema), basemap: basemapSchema })
export type RegionMap = z.infer<typeof regionMapSchema>
