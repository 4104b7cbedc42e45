import type { GetManualChunk, Plugin } from 'rollup'

const PREFIX = 'brinkwater-worker:'

/**
 * Worker threads for the server bundle. `import url from 'brinkwater-worker:<name>'` gives a function that
 * returns the file URL of `<name>`'s entry, emitted by Rollup as its own chunk (`workers/<name>.mjs` beside the server entry),
 * compiled with the same transforms and aliases as the rest of the server.
 *
 * The server's runtime sits in a manual chunk that also swallows whatever its plugins import, and loading
 * that chunk starts the server's plugins (database, scheduler, sockets). So every module a worker reaches
 * goes to a chunk of its own (`worker`), shared with the server; a worker that would reach the server
 * runtime fails the build.
 */
export function workerChunks(entries: Record<string, string>): Plugin {
  const reachable = new Set<string>()
  return {
    name: 'brinkwater-worker-chunks',
    resolveId(id) {
      return id.startsWith(PREFIX) ? `\0${id}` : null
    },
    load(id) {
      if (!id.startsWith(`\0${PREFIX}`)) return null
      const name = id.slice(PREFIX.length + 1)
      const entry = entries[name]
      if (!entry) this.error(`no worker entry named ${name}`)
      const ref = this.emitFile({ type: 'chunk', id: entry, fileName: `workers/${name}.mjs` })
      // A function: the URL is known only once the entry has run (see resolveFileUrl).
      return `export default () => import.meta.ROLLUP_FILE_URL_${ref}`
    },
    // Nitro rewrites `import.meta` in every chunk to the server entry's (globalThis._importMeta_, set when the entry at
    // the root of the output runs, after its imports), so the worker's file is found from the output root.
    resolveFileUrl({ fileName }) {
      return `new URL(${JSON.stringify(`./${fileName}`)}, globalThis._importMeta_.url).href`
    },
    buildEnd(err) {
      if (err) return
      reachable.clear()
      const entryIds = new Set(Object.values(entries))
      const todo = [...this.getModuleIds()].filter(id => entryIds.has(id))
      while (todo.length) {
        const id = todo.pop()!
        if (reachable.has(id)) continue
        const info = this.getModuleInfo(id)
        if (!info || info.isExternal) continue
        if (/nitropack[\\/]dist[\\/](runtime|presets)/.test(id)) this.error(`a worker thread reaches the server runtime: ${id}`)
        reachable.add(id)
        todo.push(...info.importedIds, ...info.dynamicallyImportedIds)
      }
      for (const id of entryIds) reachable.delete(id)
    },
    outputOptions(options) {
      const inner = options.manualChunks
      const manualChunks: GetManualChunk = (id, meta) => {
        if (reachable.has(id)) return 'worker'
        return typeof inner === 'function' ? inner(id, meta) : undefined
      }
      return { ...options, manualChunks }
    },
  }
}
