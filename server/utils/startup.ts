let ready: Promise<void> = Promise.resolve()

/** Records the start-up work (migrations, demo seed) that requests must wait for. */
export function setStartup(work: Promise<void>): void { ready = work }

/** Resolves once the start-up work is done (Nitro does not wait for async plugins before serving). */
export function startupDone(): Promise<void> { return ready }
