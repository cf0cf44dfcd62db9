/**
 * A JSON Schema (2020-12, as OpenAPI 3.1 writes it) turned into a tree a person can read: each
 * node one value with its type in words, whether it is required or can be null, its format,
 * allowed values, limits and description; objects hold their properties, arrays their item,
 * unions their choices. `$ref`s are followed into the document and keep the component's name;
 * a reference already open higher up the same branch is marked, not followed again, so a
 * schema that refers to itself ends.
 */
import { isObject, refName as nameOfRef, resolvePointer, type JsonObject } from './openapi'

export interface SchemaNode {
  /** The property name, when the node is an object's property. */
  name?: string
  /** Words for a node that is not a property: a choice of a union, a tuple's place, a map's values. */
  label?: string
  required: boolean
  /**
   * The kind of value: 'object', 'array', 'string', 'integer', 'number', 'boolean', 'null',
   * 'file', 'one of', 'any value', 'not allowed' — or several joined by ' or '.
   */
  kind: string
  /** The component this node came from (`$ref`), by name. */
  refName?: string
  nullable: boolean
  format?: string
  /** The allowed values (JSON text: `"open"`, `3`), when the schema lists them. */
  enumValues?: string[]
  /** The one allowed value (JSON text), for `const`. */
  constValue?: string
  description?: string
  /** Limits and defaults in words: `at least 1`, `1–200 characters`, `default 20`. */
  constraints: string[]
  deprecated: boolean
  /** An object's properties (then any "other keys" entry), or a tuple's places. */
  children: SchemaNode[]
  /** An array's item. */
  items?: SchemaNode
  /** The choices of a 'one of'. */
  variants: SchemaNode[]
  /** The property whose value tells the choices apart. */
  discriminator?: string
  /** A `$ref` already open above on this branch: shown by name and not expanded again. */
  cycle: boolean
  /** The `$ref` points at nothing in the document. */
  missingRef: boolean
}

/** A schema nothing satisfies (`false`, `{ not: {} }`): as a property, one to leave out. */
const NOT_ALLOWED = 'not allowed'

/** Deeper than this (without a cycle) the tree stops, so a pathological document cannot hang the page. */
const MAX_DEPTH = 40

interface Context {
  document: unknown
  /** The `$ref`s open on the path from the root to here. */
  openRefs: readonly string[]
  depth: number
}

/** The tree of `schema`, resolving `$ref`s in `document`. */
export function schemaTree(schema: unknown, document: unknown, options: { name?: string; required?: boolean } = {}): SchemaNode {
  return describe(schema, { document, openRefs: [], depth: 0 }, { name: options.name, required: options.required ?? false })
}

/** The type in words: `string`, `CaseView (object)`, `array of CaseView`, `array of string (uuid)`. */
export function typeInWords(node: SchemaNode): string {
  if (node.cycle) return `${node.refName ?? node.kind} (as above)`
  const base = shapeInWords(node)
  return node.refName ? `${node.refName} (${base})` : base
}

function shapeInWords(node: SchemaNode): string {
  if (node.kind !== 'array' || !node.items) return node.kind
  const item = node.items
  const itemWords = item.refName ?? shapeInWords(item)
  return `array of ${itemWords}${item.format && !item.refName ? ` (${item.format})` : ''}${item.nullable ? ' or null' : ''}`
}

/** Whether the node has more inside it to show (properties, an item with properties, choices). */
export function hasInside(node: SchemaNode): boolean {
  if (node.cycle) return false
  if (node.children.length > 0 || node.variants.length > 0) return true
  return node.items ? hasInside(node.items) : false
}

const text = (value: unknown): string | undefined => (typeof value === 'string' && value.trim() ? value : undefined)

/** A value as JSON text (`"open"`, `3`, `null`). */
export const jsonText = (value: unknown): string => JSON.stringify(value) ?? String(value)

const isNullSchema = (schema: unknown) =>
  isObject(schema) && (schema.type === 'null' || (Object.hasOwn(schema, 'const') && schema.const === null) || (Array.isArray(schema.enum) && schema.enum.length === 1 && schema.enum[0] === null))

interface Place {
  name?: string
  label?: string
  required: boolean
}

function emptyNode(place: Place, kind: string): SchemaNode {
  return { ...place, kind, nullable: false, constraints: [], deprecated: false, children: [], variants: [], cycle: false, missingRef: false }
}

function describe(schema: unknown, ctx: Context, place: Place): SchemaNode {
  if (schema === true || schema === undefined) return emptyNode(place, 'any value')
  if (schema === false || (isObject(schema) && isObject(schema.not) && Object.keys(schema.not).length === 0)) return emptyNode(place, NOT_ALLOWED)
  if (!isObject(schema)) return emptyNode(place, 'any value')
  if (ctx.depth > MAX_DEPTH) return { ...emptyNode(place, 'more (too deep to show)'), description: text(schema.description) }
  const deeper: Context = { ...ctx, depth: ctx.depth + 1 }

  if (typeof schema.$ref === 'string') return describeRef(schema, schema.$ref, ctx, place)

  const own: SchemaNode = {
    ...emptyNode(place, 'any value'),
    nullable: schema.nullable === true,
    description: text(schema.description),
    constraints: constraintsOf(schema),
    deprecated: schema.deprecated === true,
  }

  const union = Array.isArray(schema.oneOf) ? schema.oneOf : Array.isArray(schema.anyOf) ? schema.anyOf : null
  if (union) {
    const choices = union.filter((s) => !isNullSchema(s))
    const nullable = own.nullable || choices.length < union.length
    const rest = withoutKeys(schema, ['oneOf', 'anyOf', 'discriminator'])
    if (choices.length === 1 && !hasShape(rest)) {
      // `X or null`: the one choice, marked nullable; the outer words win over the inner ones
      const inner = describe(choices[0], deeper, place)
      return { ...inner, nullable: inner.nullable || nullable, description: own.description ?? inner.description, constraints: [...inner.constraints, ...own.constraints.filter((c) => !inner.constraints.includes(c))] }
    }
    if (choices.length === 0) return { ...own, kind: 'null', nullable: true }
    const fixed = choices.map(fixedValue)
    if (fixed.every((f) => f !== undefined)) {
      // a choice between constants is a list of allowed values
      const values = fixed.map((f) => f!.value)
      return { ...own, kind: [...new Set(values.map(jsonKind))].join(' or '), nullable, enumValues: values.map(jsonText) }
    }
    const variants = choices.map((choice) => describe(choice, deeper, { required: false }))
    const discriminator = (isObject(schema.discriminator) ? text(schema.discriminator.propertyName) : undefined) ?? sharedConstProperty(variants)
    const labelled = variants.map((v, i) => ({ ...v, label: choiceLabel(v, i, discriminator) }))
    return { ...own, kind: 'one of', nullable, variants: labelled, discriminator }
  }

  if (Array.isArray(schema.allOf)) {
    const merged = mergeAllOf(schema, ctx)
    if (merged) return describe(merged.schema, { ...ctx, openRefs: [...ctx.openRefs, ...merged.refs] }, place)
    const parts = schema.allOf.map((part) => describe(part, deeper, { required: false }))
    return { ...own, kind: 'all of', variants: parts.map((p, i) => ({ ...p, label: `Part ${i + 1}${p.refName ? `: ${p.refName}` : ''}` })) }
  }

  let types = (Array.isArray(schema.type) ? schema.type : [schema.type]).filter((t): t is string => typeof t === 'string')
  if (types.includes('null')) {
    own.nullable = true
    types = types.filter((t) => t !== 'null')
  }
  if (Array.isArray(schema.enum)) {
    if (schema.enum.includes(null)) own.nullable = true
    const values = schema.enum.filter((v) => v !== null)
    own.enumValues = values.map(jsonText)
    if (types.length === 0) types = [...new Set(values.map(jsonKind))]
  }
  if (Object.hasOwn(schema, 'const')) {
    own.constValue = jsonText(schema.const)
    if (types.length === 0) types = [jsonKind(schema.const)]
  }
  if (types.length === 0) {
    if (isObject(schema.properties) || schema.additionalProperties !== undefined) types = ['object']
    else if (schema.items !== undefined || Array.isArray(schema.prefixItems)) types = ['array']
  }
  own.format = text(schema.format)
  if (types.length === 1 && types[0] === 'string' && (own.format === 'binary' || text(schema.contentMediaType))) {
    return { ...own, kind: 'file', format: own.format ?? text(schema.contentMediaType) }
  }

  if (types.includes('object')) {
    own.children = objectChildren(schema, deeper)
  }
  if (types.includes('array')) {
    if (Array.isArray(schema.prefixItems)) {
      own.children = [
        ...own.children,
        ...schema.prefixItems.map((s, i) => describe(s, deeper, { label: `Place ${i + 1}`, required: true })),
        ...(schema.items !== undefined && schema.items !== false ? [describe(schema.items, deeper, { label: 'Any further place', required: false })] : []),
      ]
    } else if (schema.items !== undefined) {
      own.items = describe(schema.items, deeper, { required: false })
    }
  }
  const kinds = types.map((t) => (t === 'array' && Array.isArray(schema.prefixItems) ? 'tuple' : t))
  return { ...own, kind: kinds.length ? kinds.join(' or ') : 'any value' }
}

function describeRef(schema: JsonObject, ref: string, ctx: Context, place: Place): SchemaNode {
  const name = nameOfRef(ref)
  const description = text(schema.description)
  if (ctx.openRefs.includes(ref)) return { ...emptyNode(place, 'object'), refName: name, cycle: true, description }
  const target = resolvePointer(ctx.document, ref)
  if (target === undefined) return { ...emptyNode(place, 'unknown'), refName: name, missingRef: true, description }
  const inner = describe(target, { ...ctx, openRefs: [...ctx.openRefs, ref], depth: ctx.depth + 1 }, place)
  // words beside a $ref (2020-12 allows them) speak for this use of the component
  return {
    ...inner,
    refName: name,
    description: description ?? inner.description,
    nullable: inner.nullable || schema.nullable === true,
    deprecated: inner.deprecated || schema.deprecated === true,
  }
}

function objectChildren(schema: JsonObject, ctx: Context): SchemaNode[] {
  const required = new Set(Array.isArray(schema.required) ? schema.required.filter((r): r is string => typeof r === 'string') : [])
  const properties = isObject(schema.properties) ? Object.entries(schema.properties) : []
  const children = properties.map(([name, property]) => describe(property, ctx, { name, required: required.has(name) }))
  const extra = schema.additionalProperties
  if (extra !== undefined && extra !== false && !(isObject(extra) && Object.keys(extra).length === 0 && properties.length > 0)) {
    children.push(describe(extra, ctx, { label: properties.length ? 'Any other key' : 'Each key’s value', required: false }))
  }
  return children
}

/** allOf of objects (after following `$ref`s) as one object schema; null when a part is not an object. */
function mergeAllOf(schema: JsonObject, ctx: Context): { schema: JsonObject; refs: string[] } | null {
  const parts = Array.isArray(schema.allOf) ? schema.allOf : []
  const properties: JsonObject = {}
  const required: string[] = []
  const refs: string[] = []
  for (const part of parts) {
    let at: unknown = part
    while (isObject(at) && typeof at.$ref === 'string') {
      if (ctx.openRefs.includes(at.$ref) || refs.includes(at.$ref)) return null
      refs.push(at.$ref)
      at = resolvePointer(ctx.document, at.$ref)
    }
    if (!isObject(at) || !(at.type === 'object' || isObject(at.properties)) || at.allOf || at.anyOf || at.oneOf) return null
    Object.assign(properties, isObject(at.properties) ? at.properties : {})
    if (Array.isArray(at.required)) required.push(...at.required.filter((r): r is string => typeof r === 'string'))
  }
  const rest = withoutKeys(schema, ['allOf'])
  Object.assign(properties, isObject(rest.properties) ? rest.properties : {})
  if (Array.isArray(rest.required)) required.push(...rest.required.filter((r): r is string => typeof r === 'string'))
  return { schema: { ...rest, type: 'object', properties, required: [...new Set(required)] }, refs }
}

function withoutKeys(schema: JsonObject, keys: string[]): JsonObject {
  return Object.fromEntries(Object.entries(schema).filter(([key]) => !keys.includes(key)))
}

/** Whether a schema says anything about the value's shape (beyond words and limits). */
const hasShape = (schema: JsonObject) => ['type', 'properties', 'items', 'prefixItems', 'enum', 'const', 'allOf', '$ref'].some((key) => Object.hasOwn(schema, key))

/** The one value a schema allows (`const`, or an enum of one), if that is all it says. */
function fixedValue(schema: unknown): { value: unknown } | undefined {
  if (!isObject(schema) || schema.$ref !== undefined) return undefined
  if (Object.hasOwn(schema, 'const')) return { value: schema.const }
  if (Array.isArray(schema.enum) && schema.enum.length === 1) return { value: schema.enum[0] }
  return undefined
}

const jsonKind = (value: unknown): string => {
  if (value === null) return 'null'
  if (Array.isArray(value)) return 'array'
  if (typeof value === 'number') return Number.isInteger(value) ? 'integer' : 'number'
  return typeof value
}

/** A property every choice has with one fixed value (`kind: "spectrum"`), naming the choice. */
function sharedConstProperty(variants: SchemaNode[]): string | undefined {
  const fixed = (v: SchemaNode) => new Set(v.children.filter((c) => c.name && (c.constValue !== undefined || c.enumValues?.length === 1)).map((c) => c.name as string))
  if (variants.length < 2 || variants.some((v) => v.kind !== 'object')) return undefined
  const [first, ...others] = variants.map(fixed)
  return [...first].find((name) => others.every((set) => set.has(name)))
}

function choiceLabel(variant: SchemaNode, index: number, discriminator: string | undefined): string {
  const tag = discriminator ? variant.children.find((c) => c.name === discriminator) : undefined
  const value = tag?.constValue ?? (tag?.enumValues?.length === 1 ? tag.enumValues[0] : undefined)
  const what = value !== undefined ? `${discriminator} = ${value}` : variant.refName ?? typeInWords(variant)
  return `Choice ${index + 1}: ${what}`
}

/** Limits and defaults in words. */
function constraintsOf(schema: JsonObject): string[] {
  // the widest safe integers are what an integer type says already
  const n = (key: string) => (typeof schema[key] === 'number' && Math.abs(schema[key] as number) !== Number.MAX_SAFE_INTEGER ? (schema[key] as number) : undefined)
  const out: string[] = []
  const [min, max, exMin, exMax] = [n('minimum'), n('maximum'), n('exclusiveMinimum'), n('exclusiveMaximum')]
  if (min !== undefined) out.push(`at least ${min}`)
  if (exMin !== undefined) out.push(`more than ${exMin}`)
  if (max !== undefined) out.push(`at most ${max}`)
  if (exMax !== undefined) out.push(`less than ${exMax}`)
  if (n('multipleOf') !== undefined) out.push(`a multiple of ${n('multipleOf')}`)
  out.push(...range(n('minLength'), n('maxLength'), 'character', 'characters'))
  out.push(...range(n('minItems'), n('maxItems'), 'item', 'items'))
  out.push(...range(n('minProperties'), n('maxProperties'), 'key', 'keys'))
  if (schema.uniqueItems === true) out.push('no repeats')
  // a format (uuid, date-time, email) says what its generated pattern spells out
  if (text(schema.pattern) && !text(schema.format)) out.push(`matches ${schema.pattern as string}`)
  if (Object.hasOwn(schema, 'default')) out.push(`default ${jsonText(schema.default)}`)
  const example = Array.isArray(schema.examples) ? schema.examples[0] : schema.example
  if (example !== undefined && !isObject(example) && !Array.isArray(example)) out.push(`e.g. ${jsonText(example)}`)
  if (schema.readOnly === true) out.push('read only')
  if (schema.writeOnly === true) out.push('write only')
  return out
}

function range(min: number | undefined, max: number | undefined, one: string, many: string): string[] {
  if (min === undefined && max === undefined) return []
  if (min !== undefined && max !== undefined) return [min === max ? `exactly ${min} ${min === 1 ? one : many}` : `${min}–${max} ${many}`]
  if (min !== undefined) return [`at least ${min} ${min === 1 ? one : many}`]
  return [`at most ${max} ${max === 1 ? one : many}`]
}

/** Nodes of the tree in reading order with their depth, for callers that want flat rows (tests, counts). */
export function treeRows(node: SchemaNode, depth = 0): { node: SchemaNode; depth: number }[] {
  const inside = [...node.children, ...(node.items ? node.items.children : []), ...node.variants, ...(node.items ? node.items.variants : [])]
  return [{ node, depth }, ...inside.flatMap((child) => treeRows(child, depth + 1))]
}
