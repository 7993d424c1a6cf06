# Shared shell functions for scripts/start.sh and scripts/test.sh. Source it; do not run it.
# Everything lives under the repository's .data/ folder (ignored by git).

set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="${PLACEWRIGHT_DATA_DIR:-$ROOT/.data}"
export NEXT_TELEMETRY_DISABLED=1
export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED=true

log() { printf '\033[1;36m[placewright]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[placewright] %s\033[0m\n' "$*" >&2; exit 1; }

is_root() { [ "$(id -u)" -eq 0 ]; }

# Installs the Debian packages that are missing (as root), or says what to install.
ensure_debian_packages() {
  local missing=()
  local pkg
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q "install ok installed" || missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  if ! is_root; then
    die "Missing Debian packages: ${missing[*]}. Install them with: sudo apt-get install -y ${missing[*]}"
  fi
  log "Installing Debian packages: ${missing[*]}"
  apt-get update -qq || die "apt-get update failed: check the network connection to Debian's mirrors."
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null \
    || die "apt-get install ${missing[*]} failed: see the output above."
}

# npm ci when node_modules is missing or older than package-lock.json.
ensure_node_modules() {
  local marker="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$marker" ] || [ "$ROOT/package-lock.json" -nt "$marker" ]; then
    log "Installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed: see the output above."
  fi
}

pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1; }

# PostgreSQL refuses to run as root: run its tools as the postgres user when we are root.
as_pg() {
  if is_root; then runuser -u postgres -- "$@"; else "$@"; fi
}

# True for addresses that only this machine can reach.
is_loopback() {
  case "$1" in
    127.*|::1|localhost) return 0 ;;
    *) return 1 ;;
  esac
}

port_busy() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# The cluster folder must be reachable by the postgres user; a checkout under a private home
# folder is not, so fall back to a per-checkout folder under /var/tmp.
pg_cluster_dir() {
  local name="$1" dir="$DATA_DIR/$1"
  if is_root && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
    dir="/var/tmp/placewright-$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)/$name"
  fi
  printf '%s' "$dir"
}

# pg_up NAME PORT DURABLE(yes|no): initialise (once) and start a project-local cluster.
pg_up() {
  local name="$1" port="$2" durable="$3"
  local dir bin
  dir="$(pg_cluster_dir "$name")"
  bin="$(pg_bin)"
  [ -n "$bin" ] || die "PostgreSQL binaries not found under /usr/lib/postgresql."
  if [ -f "$dir/postmaster.pid" ] && as_pg "$bin/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
    log "PostgreSQL ($name) already running on 127.0.0.1:$port"
    PG_DIR="$dir"
    return 0
  fi
  if port_busy "$port"; then
    die "Port $port is busy. Stop whatever listens there (ss -ltnp 'sport = :$port') or set PG_PORT to another port."
  fi
  mkdir -p "$dir"
  if is_root; then chown postgres:postgres "$dir"; fi
  chmod 700 "$dir"
  if [ ! -f "$dir/PG_VERSION" ]; then
    log "Initialising PostgreSQL cluster ($name) in $dir"
    as_pg "$bin/initdb" -D "$dir" -U placewright --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null \
      || die "initdb failed for $dir."
    {
      echo "listen_addresses = '127.0.0.1'"
      echo "port = $port"
      echo "unix_socket_directories = ''"
      echo "max_connections = 100"
      if [ "$durable" = "no" ]; then
        # Throwaway test cluster only: durability traded for speed.
        echo "fsync = off"
        echo "synchronous_commit = off"
        echo "full_page_writes = off"
      fi
    } | as_pg tee -a "$dir/postgresql.conf" >/dev/null
  fi
  as_pg "$bin/pg_ctl" -D "$dir" -l "$dir/server.log" -w -t 60 start >/dev/null \
    || die "PostgreSQL ($name) did not start: read $dir/server.log."
  PG_DIR="$dir"
  log "PostgreSQL ($name) running on 127.0.0.1:$port"
}

pg_down() {
  local name="$1" dir bin
  dir="$(pg_cluster_dir "$name")"
  bin="$(pg_bin)"
  if [ -f "$dir/postmaster.pid" ]; then
    as_pg "$bin/pg_ctl" -D "$dir" -m fast -w stop >/dev/null 2>&1 || true
  fi
}

# pg_ensure_db PORT NAME: create the database when it does not exist.
pg_ensure_db() {
  local port="$1" db="$2" bin
  bin="$(pg_bin)"
  if ! "$bin/psql" -h 127.0.0.1 -p "$port" -U placewright -d postgres -tAc \
      "select 1 from pg_database where datname = '$db'" | grep -q 1; then
    "$bin/createdb" -h 127.0.0.1 -p "$port" -U placewright "$db" || die "Could not create database $db."
  fi
}

# start_fakes DIR: the local SMTP and S3 fakes in one background process; its pid in DIR/fakes.pid.
start_fakes() {
  local dir="$1"
  mkdir -p "$dir"
  if [ -f "$dir/fakes.pid" ] && kill -0 "$(cat "$dir/fakes.pid")" 2>/dev/null; then
    log "Local fakes already running (pid $(cat "$dir/fakes.pid"))"
    return 0
  fi
  local p
  for p in "$SMTP_PORT" "$MAILBOX_PORT" "$S3_PORT"; do
    port_busy "$p" && die "Port $p is busy (needed by the local mail/S3 fakes). Stop what listens there or change the port."
  done
  # `node` itself is the background job (not a subshell around it), so its pid is the one to stop.
  (cd "$ROOT" || exit 1
    FAKES_DIR="$dir" node --import tsx scripts/fakes.mts >"$dir/fakes.log" 2>&1 &
    echo $! >"$dir/fakes.pid")
  local i
  for i in $(seq 1 100); do
    port_busy "$MAILBOX_PORT" && port_busy "$SMTP_PORT" && port_busy "$S3_PORT" && {
      log "Local fakes: SMTP 127.0.0.1:$SMTP_PORT, mailbox http://127.0.0.1:$MAILBOX_PORT, S3 http://127.0.0.1:$S3_PORT"
      return 0
    }
    sleep 0.2
  done
  die "The local fakes did not start: read $dir/fakes.log."
}

stop_pidfile() {
  local f="$1"
  if [ -f "$f" ]; then
    local pid
    pid="$(cat "$f")"
    if kill -0 "$pid" 2>/dev/null; then
      kill "$pid" 2>/dev/null || true
      for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
      kill -9 "$pid" 2>/dev/null || true
    fi
    rm -f "$f"
  fi
}
