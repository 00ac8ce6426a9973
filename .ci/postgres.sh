# A throwaway PostgreSQL cluster for the register tests and the register benchmark. Source this file, then:
#   pg_throwaway_start     installs Debian's postgresql when missing, initdb's a cluster in a temporary folder that
#                          listens on 127.0.0.1 (and a socket in that folder) at a random free port, with password
#                          authentication, and exports CROSSCHECK_TEST_POSTGRES (an Npgsql connection string for its
#                          superuser). Returns non-zero, saying why, when it cannot.
#   pg_throwaway_stop      stops it and removes the folder (safe to call twice, and from an EXIT trap).
# Nothing system-wide is started: the cluster runs as the 'postgres' user when this shell is root (initdb refuses
# root), else as the caller.

pg_throwaway_dir=""
pg_throwaway_bin=""
pg_throwaway_as=()

pg_throwaway_start() {
  if ! ls -d /usr/lib/postgresql/*/bin >/dev/null 2>&1; then
    echo "installing Debian's postgresql for the register tests..."
    local sudo=""; [ "$(id -u)" -ne 0 ] && sudo="sudo"
    { $sudo apt-get update -qq && DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq postgresql >/dev/null; } \
      || { echo "postgresql: could not install Debian's postgresql package" >&2; return 1; }
  fi
  pg_throwaway_bin="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)"
  pg_throwaway_dir="$(mktemp -d /tmp/crosscheck-pg.XXXXXX)"
  if [ "$(id -u)" -eq 0 ]; then
    chown postgres: "$pg_throwaway_dir"
    pg_throwaway_as=(runuser -u postgres --)
  else
    pg_throwaway_as=()
  fi
  local password
  password="$(head -c 18 /dev/urandom | base64 | tr -d '/+=' | head -c 20)"
  printf '%s\n' "$password" >"$pg_throwaway_dir/pwfile"
  chmod 600 "$pg_throwaway_dir/pwfile"
  [ "$(id -u)" -eq 0 ] && chown postgres: "$pg_throwaway_dir/pwfile"
  if ! "${pg_throwaway_as[@]}" "$pg_throwaway_bin/initdb" -D "$pg_throwaway_dir/data" -U crosscheck --pwfile="$pg_throwaway_dir/pwfile" \
       -A scram-sha-256 -E UTF8 --locale=C.UTF-8 >"$pg_throwaway_dir/initdb.log" 2>&1; then
    cat "$pg_throwaway_dir/initdb.log" >&2; echo "postgresql: initdb failed" >&2; return 1
  fi
  rm -f "$pg_throwaway_dir/pwfile"
  local port tries=0
  while :; do
    tries=$((tries + 1))
    port=$((20000 + RANDOM % 40000))
    # A port something answers on is taken; try another.
    if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then continue; fi
    if "${pg_throwaway_as[@]}" "$pg_throwaway_bin/pg_ctl" -D "$pg_throwaway_dir/data" -l "$pg_throwaway_dir/server.log" -w -t 60 \
         -o "-p $port -c listen_addresses=127.0.0.1 -k $pg_throwaway_dir -c max_connections=200" start >/dev/null 2>&1; then
      break
    fi
    if [ "$tries" -ge 5 ]; then
      cat "$pg_throwaway_dir/server.log" >&2; echo "postgresql: the throwaway cluster did not start" >&2; return 1
    fi
  done
  export CROSSCHECK_TEST_POSTGRES="Host=127.0.0.1;Port=$port;Username=crosscheck;Password=$password;Database=postgres"
  echo "postgresql: throwaway cluster ($("$pg_throwaway_bin/postgres" --version | awk '{print $3}')) on 127.0.0.1:$port in $pg_throwaway_dir"
}

pg_throwaway_stop() {
  [ -n "$pg_throwaway_dir" ] || return 0
  if [ -d "$pg_throwaway_dir/data" ]; then
    "${pg_throwaway_as[@]}" "$pg_throwaway_bin/pg_ctl" -D "$pg_throwaway_dir/data" -m immediate -w stop >/dev/null 2>&1 || true
  fi
  rm -rf "$pg_throwaway_dir"
  pg_throwaway_dir=""
}
