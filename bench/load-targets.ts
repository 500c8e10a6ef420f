/** Further load-test targets that need demo files (inspect, assess); filled in as those endpoints exist. */
export async function loadTargets(): Promise<
  { name: string; method: 'GET' | 'POST'; path: string; body?: string; contentType?: string }[]
> {
  return []
}
