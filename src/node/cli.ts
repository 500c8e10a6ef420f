/**
 * @module node/cli
 * Node entry of the `dryhours` command: wires the CLI to the process and the file system.
 */
import { mkdir, readFile, stat, writeFile } from 'node:fs/promises'
import { pathToFileURL } from 'node:url'
import { type CliIo, UsageError } from '../cli/command.ts'
import { runCli } from '../cli/main.ts'

/** Plain words for the file-system errors a user can cause with a path. */
const PATH_ERRORS: Record<string, string> = {
  ENOENT: 'no such file or folder',
  ENOTDIR: 'a part of the path is not a folder',
  EISDIR: 'it is a folder',
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  EROFS: 'the file system is read-only',
  ENOSPC: 'no space left on the device',
  ENAMETOOLONG: 'the name is too long',
  EEXIST: 'it already exists',
}

function pathError(verb: string, path: string, e: unknown): UsageError {
  const code = (e as NodeJS.ErrnoException).code ?? ''
  return new UsageError(`cannot ${verb} '${path}': ${PATH_ERRORS[code] ?? code ?? 'file system error'}`)
}

export const nodeIo: CliIo = {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  readFile: async (path) => {
    try {
      return new Uint8Array(await readFile(path))
    } catch (e) {
      throw pathError('read', path, e)
    }
  },
  writeFile: async (path, data, options) => {
    try {
      // 'wx' fails when the file exists: nothing is overwritten without --force
      await writeFile(path, data, { flag: options?.overwrite ? 'w' : 'wx' })
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'EEXIST') {
        // a folder at that path is not a file to replace, with or without --force
        const folder = await stat(path).then(
          (s) => s.isDirectory(),
          () => false,
        )
        if (folder) throw pathError('write', path, { code: 'EISDIR' })
        throw new UsageError(`'${path}' already exists: give --force to replace it, or another name`)
      }
      // A missing folder, a read-only place or a folder given as the output: the user's input, exit 2.
      throw pathError('write', path, e)
    }
  },
  exists: async (path) => {
    try {
      await stat(path)
      return true
    } catch {
      return false
    }
  },
  makeDir: async (path) => {
    try {
      await mkdir(path, { recursive: true })
    } catch (e) {
      throw pathError('create the folder', path, e)
    }
  },
  startServer: async (options) => {
    const { ListenError, startServer } = await import('./server.ts')
    try {
      return await startServer(options)
    } catch (e) {
      // A busy port or an address that is not this machine's: the user's input, one line and exit 2.
      if (e instanceof ListenError) throw new UsageError(e.message)
      throw e
    }
  },
}

export async function main(argv: string[]): Promise<number> {
  return runCli(argv, nodeIo)
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  process.exitCode = await main(process.argv.slice(2))
}
