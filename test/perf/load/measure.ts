/**
 * One load measurement with autocannon over loopback: a signed-in session's cookie on every
 * request, paths chosen per request (so a search is not one cached query repeated), a short
 * warm-up that is not counted, then the measured run.
 */
import autocannon from 'autocannon';

export interface LoadFigures {
  /** Successful (2xx) answers per second over the measured run. */
  rps: number;
  p50Ms: number;
  p99Ms: number;
  meanMs: number;
  requests: number;
  connections: number;
  durationS: number;
}

export interface LoadSpec {
  baseUrl: string;
  cookie: string;
  connections: number;
  durationS: number;
  /** The next path to ask for; called once per request. */
  nextPath: () => string;
}

function run(spec: LoadSpec, durationS: number): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon(
      {
        url: spec.baseUrl,
        connections: spec.connections,
        duration: durationS,
        headers: { cookie: spec.cookie },
        requests: [
          {
            method: 'GET',
            setupRequest: (req) => ({ ...req, path: spec.nextPath() }),
          },
        ],
      },
      (err, result) => (err ? reject(err) : resolve(result)),
    );
  });
}

export async function measure(spec: LoadSpec, what: string): Promise<LoadFigures> {
  await run(spec, Math.min(2, spec.durationS));
  const r = await run(spec, spec.durationS);
  const failed = r.non2xx + r.errors;
  if (failed > 0) {
    const codes = Object.entries(r.statusCodeStats ?? {})
      .map(([code, s]) => `${code}×${s.count ?? 0}`)
      .join(', ');
    throw new Error(`${what}: ${r.non2xx} answers were not 2xx (${codes}) and ${r.errors} connection errors; the figures would mean nothing.`);
  }
  return {
    rps: r['2xx'] / r.duration,
    p50Ms: r.latency.p50,
    p99Ms: r.latency.p99,
    meanMs: r.latency.average,
    requests: r['2xx'],
    connections: spec.connections,
    durationS: r.duration,
  };
}
