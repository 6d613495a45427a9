/**
 * The JS each route loads, gzip-compressed: the app's own Vite build written with a manifest into a scratch folder
 * (`vite build --manifest --outDir <dir>`; the shared apps/web/dist is left alone), then for every lazy route the
 * static-import closure of the entry, of the signed-in layout (app-root) for signed-in routes, and of the route chunk.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { repoRoot, type Figure } from './support';

interface Chunk { file: string; src?: string; isEntry?: boolean; isDynamicEntry?: boolean; imports?: string[]; dynamicImports?: string[] }

export function buildWebWithManifest(outDir: string): void {
  execFileSync(path.join(repoRoot, 'node_modules', '.bin', 'vite'), ['build', '--manifest', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'], {
    cwd: path.join(repoRoot, 'apps', 'web'), stdio: ['ignore', 'ignore', 'inherit'], timeout: 180_000,
  });
}

export function benchWebBundle(outDir: string): { figures: Figure[]; detail: string } {
  const manifest = JSON.parse(readFileSync(path.join(outDir, '.vite', 'manifest.json'), 'utf8')) as Record<string, Chunk>;
  const gz = new Map<string, number>();
  const sizeOf = (file: string) => {
    if (!gz.has(file)) gz.set(file, gzipSync(readFileSync(path.join(outDir, file))).length);
    return gz.get(file)!;
  };
  const closure = (key: string, into = new Set<string>()) => {
    if (into.has(key)) return into;
    into.add(key);
    for (const k of manifest[key]?.imports ?? []) closure(k, into);
    return into;
  };
  const kb = (keys: Set<string>) => [...keys].filter((k) => manifest[k]!.file.endsWith('.js')).reduce((s, k) => s + sizeOf(manifest[k]!.file), 0) / 1000;
  const entryKey = Object.keys(manifest).find((k) => manifest[k]!.isEntry)!;
  const layoutKey = Object.keys(manifest).find((k) => k.endsWith('routes/app-root.tsx'));
  const entry = closure(entryKey);
  const routes = Object.keys(manifest).filter((k) => manifest[k]!.isDynamicEntry && /\/app\/routes\//.test(k) && !k.endsWith('app-root.tsx'));
  const perRoute = routes.map((k) => {
    const signedIn = !/\/routes\/(auth|errors)\//.test(k);
    const all = new Set([...entry, ...(signedIn && layoutKey ? closure(layoutKey) : []), ...closure(k)]);
    return { route: k.replace(/^.*\/app\/routes\//, '').replace(/\.tsx$/, ''), kb: kb(all), own: kb(new Set([...closure(k)].filter((x) => !entry.has(x)))) };
  }).sort((a, b) => a.route.localeCompare(b.route));
  const of = (name: string) => perRoute.find((r) => r.route === name)?.kb ?? NaN;
  const calendarChunk = Object.keys(manifest).find((k) => k.endsWith('routes/calendar/calendar.tsx'));
  const calendarLazy = !!calendarChunk && !entry.has(calendarChunk);
  const figures: Figure[] = [
    { section: '5', name: 'entry JS (index.html + static imports)', value: kb(entry), unit: 'kB gz' },
    { section: '5', name: 'first route, signed out: /sign-in', value: of('auth/sign-in'), unit: 'kB gz', target: { max: 250 } },
    { section: '5', name: 'first route, signed in: /calendar', value: of('calendar/calendar'), unit: 'kB gz', target: { max: 250 }, note: `calendar chunk lazy: ${calendarLazy ? 'yes' : 'NO'}` },
    ...perRoute.filter((r) => r.route !== 'auth/sign-in' && r.route !== 'calendar/calendar').map((r): Figure => ({ section: '5', name: `route ${r.route}`, value: r.kb, unit: 'kB gz', note: `${r.own.toFixed(1)} kB beyond the entry` })),
  ];
  const calendarFiles = calendarChunk ? [...closure(calendarChunk)].filter((k) => !entry.has(k) && manifest[k]!.file.endsWith('.js')) : [];
  const biggest = calendarFiles.map((k) => ({ k, size: sizeOf(manifest[k]!.file) / 1000 })).sort((a, b) => b.size - a.size).slice(0, 6);
  return {
    figures,
    detail: `manifest: ${Object.keys(manifest).length} chunks; gzip level 6 (zlib default), JS only; /calendar beyond the entry: ${biggest.map((b) => `${b.k.replace(/^.*node_modules\//, '')} ${b.size.toFixed(1)} kB`).join(', ')}`,
  };
}
