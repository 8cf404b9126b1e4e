# Shared set-up steps for start.sh, test.sh and dev.sh: dependencies, PostgreSQL, Chromium.
# Sourced, not run. Every step installs what is missing and leaves what is there.

project_root=$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)
cd "$project_root"

log() { printf '\033[1m[outroll]\033[0m %s\n' "$*"; }

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; else sudo "$@"; fi
}

apt_updated=0
apt_install() {
  if [ "$apt_updated" -eq 0 ]; then
    log "Updating Debian's package lists"
    as_root apt-get update -qq
    apt_updated=1
  fi
  log "Installing Debian packages: $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "Installing npm dependencies (npm ci)"
    npm ci --no-audit --no-fund
  fi
}

postgres_bin_dir() {
  ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1
}

ensure_postgres_package() {
  local bin
  bin=$(postgres_bin_dir)
  if [ -z "$bin" ] || [ ! -x "$bin/initdb" ]; then
    apt_install postgresql
    # Debian starts its own cluster on port 5432; ours runs separately, so stop Debian's.
    as_root service postgresql stop >/dev/null 2>&1 || true
  fi
  PG_BIN=$(postgres_bin_dir)
  export PG_BIN
}

# Debian's nginx, the reverse proxy of the two-process tests and of the deploy/ set-up; run with a config of our own.
ensure_nginx() {
  if ! command -v nginx >/dev/null 2>&1 && [ ! -x /usr/sbin/nginx ]; then
    apt_install nginx
    # Debian starts its own nginx on port 80; ours runs on loopback ports with deploy/ or test configs, so stop Debian's.
    as_root service nginx stop >/dev/null 2>&1 || true
  fi
  NGINX_BIN=$(command -v nginx || echo /usr/sbin/nginx)
  export NGINX_BIN
}

ensure_chromium() {
  if ! command -v chromium >/dev/null 2>&1; then
    apt_install chromium
  fi
}

# Runs a PostgreSQL command as the cluster's owner: the postgres user when we are root (initdb refuses root).
as_cluster_owner() {
  if [ "$(id -u)" -eq 0 ]; then
    runuser -u postgres -- "$@"
  else
    "$@"
  fi
}

# cluster_dir_for PREFERRED_DIR: prints where the cluster can live. As root, the postgres user must reach the folder; a
# clone inside a private folder (a home folder, a mktemp -d folder) keeps its cluster under /var/lib/outroll/ instead,
# in a folder named after the clone's path, and says so. Nothing in the clone's permissions is changed.
cluster_dir_for() {
  local preferred=$1 parent
  parent=$(dirname "$preferred")
  mkdir -p "$parent"
  if [ "$(id -u)" -ne 0 ] || runuser -u postgres -- test -d "$parent" 2>/dev/null; then
    echo "$preferred"
    return 0
  fi
  local key
  key=$(printf '%s' "$project_root" | sha256sum | cut -c1-12)
  local fallback="/var/lib/outroll/$key/postgres"
  mkdir -p "$fallback"
  chmod 755 /var/lib/outroll "/var/lib/outroll/$key"
  echo "$fallback"
}

# start_cluster DATA_DIR PORT: creates the cluster if missing and starts it on 127.0.0.1:PORT.
start_cluster() {
  local data_dir=$1 port=$2
  mkdir -p "$data_dir"
  data_dir=$(cd "$data_dir" && pwd)
  if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$data_dir"; fi
  chmod 700 "$data_dir"
  if ! as_cluster_owner test -w "$data_dir"; then
    log "The postgres user cannot write $data_dir: every folder above it must be open to it (chmod o+x)."
    return 1
  fi
  if [ ! -f "$data_dir/PG_VERSION" ]; then
    log "Creating a PostgreSQL cluster in $data_dir"
    as_cluster_owner "$PG_BIN/initdb" -D "$data_dir" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if as_cluster_owner "$PG_BIN/pg_ctl" -D "$data_dir" status >/dev/null 2>&1; then
    return 0
  fi
  log "Starting PostgreSQL on 127.0.0.1:$port"
  as_cluster_owner "$PG_BIN/pg_ctl" -D "$data_dir" -l "$data_dir/server.log" -w -t 60 \
    -o "-p $port -c listen_addresses=127.0.0.1 -c unix_socket_directories=$data_dir -c max_connections=200" start >/dev/null
}

stop_cluster() {
  local data_dir=$1
  as_cluster_owner "$PG_BIN/pg_ctl" -D "$data_dir" -m fast -w stop >/dev/null 2>&1 || true
}

# ensure_database PORT NAME: creates the database if it does not exist.
ensure_database() {
  local port=$1 name=$2
  if ! "$PG_BIN/psql" -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname = '$name'" postgres | grep -q 1; then
    "$PG_BIN/createdb" -h 127.0.0.1 -p "$port" -U postgres "$name"
  fi
}
