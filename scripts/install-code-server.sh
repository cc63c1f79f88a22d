#!/bin/bash
# Installs VS Code (as code-server 4.100.3, i.e. VS Code 1.100, from the npm registry) and
# playwright-core into .vscode-test/, outside the project's dependencies, for
# `npm run test:vscode`. Needs Debian packages for the native modules and ripgrep (whose npm
# package would download a binary from outside the registries), and Chromium to drive the editor.
# Takes 3–5 minutes the first time; does nothing when the install is there.
set -euo pipefail
cd "$(dirname "$0")/.."
DIR=.vscode-test
CS=$DIR/node_modules/code-server
if [ -x "$DIR/node_modules/.bin/code-server" ] && [ -e "$CS/lib/vscode/node_modules.asar" ] && [ -d "$DIR/node_modules/playwright-core" ]; then
  echo "code-server is installed in $DIR"
  exit 0
fi

need=()
for p in libkrb5-dev libsecret-1-dev libxkbfile-dev libx11-dev ripgrep chromium; do
  dpkg -s "$p" >/dev/null 2>&1 || need+=("$p")
done
if [ ${#need[@]} -gt 0 ]; then
  echo "installing Debian packages: ${need[*]}"
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >/dev/null
fi

mkdir -p "$DIR"
[ -f "$DIR/package.json" ] || echo '{ "name": "comove-vscode-test", "private": true }' > "$DIR/package.json"
# Scripts off: code-server's own post-install would fetch ripgrep from outside the registries.
(cd "$DIR" && npm install --no-audit --no-fund --ignore-scripts code-server@4.100.3 playwright-core@1.65.1)
(cd "$DIR" && npm_config_yes=true npm rebuild argon2 --build-from-source >/dev/null)

# What code-server's post-install does, with Debian's ripgrep in place of the downloaded one.
(
  cd "$CS/lib/vscode"
  npm install --omit=dev --ignore-scripts --no-audit --no-fund
  mkdir -p node_modules/@vscode/ripgrep/bin
  ln -sf "$(command -v rg)" node_modules/@vscode/ripgrep/bin/rg
  npm_config_yes=true npm rebuild --omit=dev >/dev/null
  ln -sfn node_modules node_modules.asar
  (cd bin/remote-cli && ln -sf code-linux.sh code-server)
  (cd bin/helpers && ln -sf browser-linux.sh browser.sh)
  (cd extensions && npm install --omit=dev --no-audit --no-fund)
)
echo "code-server installed in $DIR"
