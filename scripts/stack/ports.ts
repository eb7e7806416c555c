// Port choice per profile, user overrides, and a bind probe run before anything starts.
import net from 'node:net';
import type { Profile } from './layout';

export const PORT_VARIABLES = ['PORT', 'DB_PORT', 'S3_PORT', 'SMTP_PORT', 'DOI_PORT', 'ORCID_PORT'] as const;
export type PortVariable = (typeof PORT_VARIABLES)[number];
export type Ports = Record<PortVariable, number>;

export const DEFAULT_PORTS: Record<Profile, Ports> = {
  dev: { PORT: 3000, DB_PORT: 3307, S3_PORT: 4568, SMTP_PORT: 2525, DOI_PORT: 4610, ORCID_PORT: 4630 },
  test: { PORT: 3101, DB_PORT: 3317, S3_PORT: 4578, SMTP_PORT: 2535, DOI_PORT: 4620, ORCID_PORT: 4640 },
};

export const PORT_SERVICE: Record<PortVariable, string> = {
  PORT: 'the Ohmstead web app',
  DB_PORT: 'MariaDB',
  S3_PORT: 's3rver (object storage)',
  SMTP_PORT: 'the SMTP fake',
  DOI_PORT: 'the DOI fake',
  ORCID_PORT: 'the ORCID sign-in fake',
};

export class ConfigError extends Error {}

/** Defaults for the profile, overridden by PORT, DB_PORT, … from the environment. */
export function resolvePorts(profile: Profile, environment: Record<string, string | undefined> = process.env): Ports {
  const ports = { ...DEFAULT_PORTS[profile] };
  for (const name of PORT_VARIABLES) {
    const raw = environment[name];
    if (raw === undefined || raw === '') continue;
    const n = Number(raw);
    if (!Number.isInteger(n) || n < 1 || n > 65535) throw new ConfigError(`${name}=${raw} is not a TCP port (1–65535).`);
    ports[name] = n;
  }
  const seen = new Map<number, PortVariable>();
  for (const name of PORT_VARIABLES) {
    const other = seen.get(ports[name]);
    if (other) throw new ConfigError(`${other} and ${name} are both ${ports[name]}; give each service its own port.`);
    seen.set(ports[name], name);
  }
  return ports;
}

export function portTakenMessage(variable: PortVariable, port: number, command: string, reason = 'EADDRINUSE'): string {
  const what = reason === 'EADDRINUSE' ? 'is already in use' : `cannot be bound (${reason})`;
  return (
    `Port ${port} on 127.0.0.1 ${what}, so ${PORT_SERVICE[variable]} cannot start.\n` +
    `Stop whatever listens there (see: ss -ltnp 'sport = :${port}') or choose another port: ${variable}=${port + 1} ${command}`
  );
}

/** Resolves null when the port can be bound on 127.0.0.1, else the error code. */
export function probePort(port: number, host = '127.0.0.1'): Promise<string | null> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', (error: NodeJS.ErrnoException) => resolve(error.code ?? error.message));
    server.listen({ port, host, exclusive: true }, () => server.close(() => resolve(null)));
  });
}

export async function assertPortFree(variable: PortVariable, port: number, command: string): Promise<void> {
  const problem = await probePort(port);
  if (problem) throw new ConfigError(portTakenMessage(variable, port, command, problem));
}

/** Checks every port before any service starts, so a clash stops the run with nothing to clean up. */
export async function assertPortsFree(ports: Ports, command: string): Promise<void> {
  const problems: string[] = [];
  for (const name of PORT_VARIABLES) {
    const problem = await probePort(ports[name]);
    if (problem) problems.push(portTakenMessage(name, ports[name], command, problem));
  }
  if (problems.length) throw new ConfigError(problems.join('\n\n'));
}
