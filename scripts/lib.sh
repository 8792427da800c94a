# Shared by start.sh and test.sh: make a bare machine ready to run Loadline.
set -euo pipefail
root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$root"

log() { echo "loadline: $*"; }

apt_install() {
  local missing=()
  local pkg
  for pkg in "$@"; do dpkg -s "$pkg" >/dev/null 2>&1 || missing+=("$pkg"); done
  [ ${#missing[@]} -eq 0 ] && return 0
  [ "$(id -u)" = 0 ] || { echo "loadline: need root to install ${missing[*]}" >&2; exit 1; }
  log "installing ${missing[*]} from Debian…"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null
  apt-get install -y -qq "${missing[@]}" >/dev/null
}

# npm ci when node_modules is missing or older than the lock file it was installed from.
ensure_node_modules() {
  local want have=""
  want=$(sha1sum package-lock.json | cut -d' ' -f1)
  [ -f node_modules/.loadline-lock ] && have=$(cat node_modules/.loadline-lock)
  if [ "$want" != "$have" ]; then
    log "installing node modules (npm ci)…"
    npm ci --no-audit --no-fund --loglevel=error
    echo "$want" > node_modules/.loadline-lock
  fi
}

# Rebuild the client only when its sources changed since the last build.
ensure_client_build() {
  local want have=""
  want=$(cat package-lock.json vite.config.ts tsconfig*.json <(find client shared -type f -not -name '*.spec.ts' -print0 | sort -z | xargs -0 sha1sum) | sha1sum | cut -d' ' -f1)
  [ -f dist/client/.build-hash ] && have=$(cat dist/client/.build-hash)
  if [ "$want" != "$have" ] || [ ! -f dist/client/index.html ]; then
    log "building the client…"
    npx vite build --logLevel warn
    echo "$want" > dist/client/.build-hash
  fi
}

tsx_server() { npx tsx --tsconfig tsconfig.server.json "$@"; }
