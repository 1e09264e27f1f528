-- Stops each wrk thread after MAX_REQUESTS responses (environment, default 200000), so a run is bounded in
-- count as well as in time. With BODY_FILE set, every request is a POST of that file as application/json.
local max_requests = tonumber(os.getenv("MAX_REQUESTS") or "200000")
local body_file = os.getenv("BODY_FILE")
local responses = 0
local bad = 0

if body_file and body_file ~= "" then
  local f = assert(io.open(body_file, "rb"))
  wrk.method = "POST"
  wrk.body = f:read("*a")
  wrk.headers["Content-Type"] = "application/json"
  f:close()
end

local threads = {}
function setup(thread)
  table.insert(threads, thread)
end

function response(status, headers, body)
  responses = responses + 1
  if status ~= 200 then
    bad = bad + 1
  end
  if responses >= max_requests then
    wrk.thread:stop()
  end
end

function done(summary, latency, requests)
  io.write(string.format("non200 %d\n", summary.errors.status))
end
