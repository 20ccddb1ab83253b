# Shared by the start, dev, test and bench scripts: make sure what Crestline needs is installed.
export PATH="$PATH:/usr/sbin:/usr/local/sbin"

# npm packages, from the lock file, when node_modules is missing or older than the lock.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "Installing npm packages..."
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# A Debian package, installed when the command it provides is missing.
ensure_apt() {
  local command=$1 package=$2
  if ! command -v "$command" >/dev/null 2>&1; then
    echo "Installing $package from Debian's packages..."
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >/dev/null
    apt-get install -y -qq "$package" >/dev/null
  fi
}
