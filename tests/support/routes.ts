/** Lists every route of an Express 5 router, walking sub-routers mounted at '/'. */
import type { Router } from 'express'

interface LayerLike {
  route?: { path: string; methods: Record<string, boolean> }
  handle?: { stack?: LayerLike[] }
}

export function listRoutes(router: Router): string[] {
  const out: string[] = []
  const walk = (stack: LayerLike[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [m, on] of Object.entries(layer.route.methods)) if (on && m !== '_all') out.push(`${m.toUpperCase()} /api${layer.route.path}`)
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack)
      }
    }
  }
  walk((router as unknown as { stack: LayerLike[] }).stack)
  return [...new Set(out)].sort()
}
