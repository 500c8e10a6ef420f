/**
 * @module web/demo-files
 * Demo weather files for the page. The core reads no files and the demo climates (about 10 MB of text)
 * are too large to bundle into a Worker, so an entry point that can read them (the Node server) passes
 * a provider; without one the page offers upload only.
 */

export interface DemoFile {
  /** File name in climate-demo/ (also the form value). */
  file: string
  /** What the page shows, e.g. "Ardentine Ridge (dry upland), 2021–2024, CSV". */
  label: string
  /** Reader options the file needs (e.g. the IANA zone of a local-time file), as the demo catalogue says. */
  readOptions?: Record<string, unknown>
}

export interface DemoProvider {
  list(): readonly DemoFile[]
  /** The file's bytes, or null when it is not a demo file. */
  read(file: string): Promise<Uint8Array | null>
}
