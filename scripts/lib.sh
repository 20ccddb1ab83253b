# Shared by the start, dev, test, bench and db scripts: make sure what Crestline needs is installed, and
# keep one Crestline per data folder.
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

# DATA_DIR (default .data), made absolute so that the server, MariaDB and the messages agree on it, and
# private: it holds the session secret, the uploaded originals and the database files.
use_data_dir() {
  DATA_DIR=${DATA_DIR:-.data}
  mkdir -p "$DATA_DIR"
  chmod 700 "$DATA_DIR"
  DATA_DIR=$(cd "$DATA_DIR" && pwd)
  export DATA_DIR
}

# Whether something accepts connections on 127.0.0.1:PORT (bash's /dev/tcp; a refused connection
# answers at once, and `timeout` bounds a firewall that drops instead).
port_in_use() {
  timeout 2 bash -c "exec 3<>/dev/tcp/127.0.0.1/$1" 2>/dev/null
}

# Ends the script with the one line the server prints for the same case (server/startupError.ts).
refuse_taken_port() {
  local port=$1 variable=$2
  if [ "$port" != 0 ] && port_in_use "$port"; then
    echo "Crestline cannot start: port $port on 127.0.0.1 is already in use; set $variable to a free port." >&2
    exit 1
  fi
}

# A field of a key=value lock file (pid, started, url), empty when absent.
lock_field() {
  sed -n "s/^$2=//p" "$1" 2>/dev/null | head -1
}

# State and start time (clock ticks since boot) of a process, from /proc/PID/stat fields 3 and 22.
process_stat() {
  sed -E 's/^.*\) //' "/proc/$1/stat" 2>/dev/null | cut -d' ' -f1,20
}

# Whether DATA_DIR/server.lock names a live server, as isAlive in server/services/dataDirLock.ts
# decides: its pid runs, is no zombie, and started when the lock says (so a reused pid does not count).
live_server() {
  local lock="$DATA_DIR/server.lock" pid started state now
  pid=$(lock_field "$lock" pid)
  started=$(lock_field "$lock" started)
  [ -n "$pid" ] || return 1
  if [ ! -d /proc/self ]; then
    kill -0 "$pid" 2>/dev/null
    return
  fi
  read -r state now <<<"$(process_stat "$pid")" || return 1
  [ -n "$now" ] && [ "$state" != Z ] && [ "$state" != X ] && { [ -z "$started" ] || [ "$now" = "$started" ]; }
}

# The two lines of the server's own message (alreadyRunning in server/services/dataDirLock.ts).
already_running() {
  local pid=$1 url=$2
  [ "$url" = starting ] && url="still starting"
  echo "Crestline is already running from this folder ($DATA_DIR): pid $pid, $url" >&2
  echo "Stop that one first (Ctrl-C in its terminal, or kill $pid), or give this one its own DATA_DIR." >&2
}

# Makes this script the one that runs Crestline from DATA_DIR, or ends it with exit 1 and the pid and
# address of the one that does, before anything (packages, MariaDB) is touched. The lock is flock(1)
# on fd 9, which the kernel drops when this shell ends, however it ends, so a killed start never
# leaves a stale lock behind. Long-lived children must not inherit fd 9 (run them with 9>&-): MariaDB
# left running, or a helper process of the server (tsx's esbuild) still exiting, would keep the
# folder locked. The server holds DATA_DIR/server.lock instead, which live_server checks below.
take_data_dir() {
  local lock="$DATA_DIR/start.lock" url=$1
  exec 9>>"$lock"
  if ! flock -n 9; then
    if live_server; then
      already_running "$(lock_field "$DATA_DIR/server.lock" pid)" "$(lock_field "$DATA_DIR/server.lock" url)"
    else
      already_running "$(lock_field "$lock" pid)" "$(lock_field "$lock" url)"
    fi
    exit 1
  fi
  # A server started by hand (`node --import tsx server/index.ts`) holds no flock, only server.lock.
  if live_server; then
    already_running "$(lock_field "$DATA_DIR/server.lock" pid)" "$(lock_field "$DATA_DIR/server.lock" url)"
    exit 1
  fi
  printf 'pid=%s\nurl=%s\n' "$$" "$url" >"$lock"
}
