#!/usr/bin/env bash
# Installs the tools of the end-to-end editor tests, outside the project's node_modules:
#   - Neovim (Debian package) for tests/e2e/neovim.test.ts
#   - Chromium, ripgrep, fonts (Debian packages) and code-server 4.100.3 (npm, into .cache/e2e/cs) for
#     tests/e2e/vscode.test.ts
# Safe to run again: finished steps are skipped. Needs root (or sudo) for apt-get.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
E2E="${KERNWRIGHT_E2E_DIR:-$ROOT/.cache/e2e}"
CODE_SERVER_VERSION=4.100.3
mkdir -p "$E2E"

SUDO=""
if [ "$(id -u)" != 0 ]; then SUDO="sudo"; fi

need_apt=()
command -v nvim >/dev/null 2>&1 || need_apt+=(neovim)
command -v rg >/dev/null 2>&1 || need_apt+=(ripgrep)
[ -x /usr/bin/chromium ] || need_apt+=(chromium)
dpkg -s libkrb5-dev >/dev/null 2>&1 || need_apt+=(libkrb5-dev)
dpkg -s fonts-dejavu-core >/dev/null 2>&1 || need_apt+=(fonts-dejavu-core)
if [ ${#need_apt[@]} -gt 0 ]; then
  echo "e2e setup: apt-get install ${need_apt[*]}"
  $SUDO apt-get -o DPkg::Lock::Timeout=900 update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get -o DPkg::Lock::Timeout=900 install -y -qq --no-install-recommends "${need_apt[@]}"
fi

CS="$E2E/cs"
if [ -x "$CS/node_modules/.bin/code-server" ] && grep -q "\"version\": \"$CODE_SERVER_VERSION\"" "$CS/node_modules/code-server/package.json" 2>/dev/null; then
  echo "e2e setup: code-server $CODE_SERVER_VERSION already installed in $CS"
else
  echo "e2e setup: installing code-server $CODE_SERVER_VERSION into $CS"
  mkdir -p "$CS" "$E2E/xdg/config" "$E2E/xdg/data" "$E2E/xdg/cache" "$E2E/xdg/state" "$E2E/tmp" "$E2E/rgtar"
  export XDG_CONFIG_HOME="$E2E/xdg/config" XDG_DATA_HOME="$E2E/xdg/data" XDG_CACHE_HOME="$E2E/xdg/cache" XDG_STATE_HOME="$E2E/xdg/state"
  export PLAYWRIGHT_BROWSERS_PATH="$E2E/xdg/pw" PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD=1 TMPDIR="$E2E/tmp"
  # @vscode/ripgrep's postinstall downloads a binary: hand it a "cached download" made from Debian's rg instead.
  mkdir -p "$TMPDIR/vscode-ripgrep-cache-1.15.11"
  cp "$(command -v rg)" "$E2E/rgtar/rg"
  tar czf "$TMPDIR/vscode-ripgrep-cache-1.15.11/ripgrep-v13.0.0-10-x86_64-unknown-linux-musl.tar.gz" -C "$E2E/rgtar" rg
  [ -f "$CS/package.json" ] || echo '{ "name": "kernwright-e2e-code-server", "private": true }' > "$CS/package.json"
  (cd "$CS" && npm_config_unsafe_perm=true npm_config_yes=true npm install --no-audit --no-fund --foreground-scripts "code-server@$CODE_SERVER_VERSION")
fi
echo "e2e setup: done (nvim: $(command -v nvim || echo missing), chromium: $( [ -x /usr/bin/chromium ] && echo /usr/bin/chromium || echo missing))"
