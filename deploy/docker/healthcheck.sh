#!/usr/bin/env bash
# Container health check: exit 0 when GET /healthz on the REST endpoint answers 200, else 1.
# The .NET runtime images carry neither curl nor wget, so bash's /dev/tcp does the request. The port comes from
# the same Kestrel__Endpoints__Rest__Url variable the service binds to, so the two cannot drift apart.
set -u
url="${Kestrel__Endpoints__Rest__Url:-http://127.0.0.1:5080}"
port="${url##*:}"
port="${port%%/*}"

exec 3<>"/dev/tcp/127.0.0.1/${port}" 2>/dev/null || exit 1
printf 'GET /healthz HTTP/1.1\r\nHost: localhost\r\nConnection: close\r\n\r\n' >&3
IFS= read -r -t 5 status_line <&3 || exit 1
case "${status_line}" in
  "HTTP/1.1 200 "*) exit 0 ;;
  *) exit 1 ;;
esac
