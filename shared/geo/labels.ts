/** Greedy placement of map labels that do not overlap each other, the markers or the edges. */

export interface LabelItem { id: string; x: number; y: number; text: string }
export interface PlacedLabel { x: number; y: number; anchor: 'start' | 'end' | 'middle' }
interface Box { x0: number; y0: number; x1: number; y1: number }

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1

/** Rough text width of the UI sans-serif: 0.55 em per character (common practice, no source). */
export const textWidth = (text: string, fontPx: number) => text.length * fontPx * 0.55

/**
 * Places each label (in the given order: put the most important first) right, left, above or below its
 * marker, whichever fits first; a label that fits nowhere is left out (null) rather than overprinted.
 */
export function placeLabels(
  items: readonly LabelItem[],
  o: { width: number; height: number; fontPx: number; markerPx: number; blocked?: Box[] },
): Map<string, PlacedLabel | null> {
  const taken: Box[] = [
    ...(o.blocked ?? []),
    ...items.map(i => ({ x0: i.x - o.markerPx, y0: i.y - o.markerPx, x1: i.x + o.markerPx, y1: i.y + o.markerPx })),
  ]
  const out = new Map<string, PlacedLabel | null>()
  const h = o.fontPx * 1.2, gap = o.markerPx + 3
  for (const it of items) {
    const w = textWidth(it.text, o.fontPx)
    const options: Array<[Box, PlacedLabel]> = [
      [{ x0: it.x + gap, y0: it.y - h / 2, x1: it.x + gap + w, y1: it.y + h / 2 }, { x: it.x + gap, y: it.y, anchor: 'start' }],
      [{ x0: it.x - gap - w, y0: it.y - h / 2, x1: it.x - gap, y1: it.y + h / 2 }, { x: it.x - gap, y: it.y, anchor: 'end' }],
      [{ x0: it.x - w / 2, y0: it.y - gap - h, x1: it.x + w / 2, y1: it.y - gap }, { x: it.x, y: it.y - gap - h / 2, anchor: 'middle' }],
      [{ x0: it.x - w / 2, y0: it.y + gap, x1: it.x + w / 2, y1: it.y + gap + h }, { x: it.x, y: it.y + gap + h / 2, anchor: 'middle' }],
    ]
    const fit = options.find(([b]) => b.x0 >= 2 && b.y0 >= 2 && b.x1 <= o.width - 2 && b.y1 <= o.height - 2
      && !taken.some(t => overlaps(b, t)))
    if (fit) taken.push(fit[0])
    out.set(it.id, fit ? fit[1] : null)
  }
  return out
}
