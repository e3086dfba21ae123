-- The portal's six reads in turn, for wrk against a running service with the demo laboratory:
--   wrk -t1 -c4 -d15s -s src/test/wrk/portal-mix.lua \
--       -H "Authorization: Basic $(printf demo-customer:demo-password | base64)" http://127.0.0.1:8080
-- The CPU the service used per request: read utime+stime (fields 14 and 15 of /proc/<pid>/stat, in clock ticks)
-- before and after, and divide by the request count wrk prints. See docs/RELIABILITY.md §4.
local paths = {
  "/api/v1/certificates?size=20",
  "/api/v1/certificates?number=IC-2026-000",
  "/api/v1/certificates/IC-2026-00001",
  "/api/v1/certificates/IC-2026-00001/pdf",
  "/api/v1/orders",
  "/api/v1/heats",
}
local i = 0

request = function()
  i = i + 1
  return wrk.format("GET", paths[(i % #paths) + 1])
end
