// Whether build/ (the JavaScript that `npm install` compiles from src/ through the `prepare`
// script) is there and at least as new as every source file. When it is not — a source edited
// since, or an install that skipped the build — the entry points run the TypeScript sources
// through tsx instead, so stale compiled code never runs.
import { readdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

function newest(dir) {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = `${dir}/${e.name}`;
    if (e.isDirectory()) t = Math.max(t, newest(p));
    else if (e.name.endsWith('.ts')) t = Math.max(t, statSync(p).mtimeMs);
  }
  return t;
}

export function freshBuild(root) {
  try {
    const built = statSync(new URL('build/index.js', root)).mtimeMs;
    return built >= newest(fileURLToPath(new URL('src', root)));
  } catch {
    return false;
  }
}
