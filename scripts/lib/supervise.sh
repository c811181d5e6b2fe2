# supervise NAME COMMAND…: runs COMMAND and starts it again whenever it exits, waiting 1, 2, 4 …
# up to 30 s between starts (the wait starts again at 1 s after a run of a minute or more).
# TERM or INT stops the command and the loop. Sourced by scripts/start.sh; run it in a subshell (&).
supervise() {
  local name=$1; shift
  local delay=1 child='' started code
  trap 'trap - TERM INT; [ -n "$child" ] && kill -TERM "$child" 2>/dev/null; wait "$child" 2>/dev/null; exit 0' TERM INT
  while :; do
    started=$SECONDS
    "$@" & child=$!
    code=0; wait "$child" || code=$?
    child=''
    [ $((SECONDS - started)) -ge 60 ] && delay=1
    printf '\033[1m[timefield]\033[0m %s stopped (exit code %s); starting it again in %s s\n' "$name" "$code" "$delay" >&2
    sleep "$delay" & child=$!; wait "$child" || true; child=''
    delay=$((delay * 2)); [ "$delay" -gt 30 ] && delay=30
  done
}
