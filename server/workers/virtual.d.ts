// Worker entries emitted by server/build/worker-chunks.ts: the default export returns the entry's file URL.
declare module 'brinkwater-worker:*' {
  const url: () => string
  export default url
}
