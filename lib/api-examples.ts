// The API examples shown on the API page and in the README (a test checks the README holds them word for word,
// and runs the Python one against the test server). Plain strings: client-safe, no imports.

/** The demo lab's slug, used in the examples; scripts set their own through EPICYCLE_LAB. */
const LAB = 'halden-form';

export interface ApiExample {
  readonly task: string;
  readonly curl: string;
  readonly r: string;
}

const RENDER_JSON =
  '{"sizeDeg": 4, "sizeMeasure": "equal-area-diameter", "canvasDeg": 6, "style": "silhouette", "strokeArcmin": null, "fill": 0, "background": 128, "antiAlias": true, "transparent": false, "samples": 512}';

/** Per task: a shell one-liner with curl (and jq) and the same in R with httr2. */
export const API_EXAMPLES: readonly ApiExample[] = [
  {
    task: 'List the approved editions',
    curl: `curl -s -H "Authorization: Bearer $EPICYCLE_TOKEN" \\
  "$EPICYCLE_URL/api/v1/labs/${LAB}/editions?state=approved" | jq '.items[] | {spaceName, number, contentHash}'`,
    r: `library(httr2)
api <- function(path) {
  request(Sys.getenv("EPICYCLE_URL")) |>
    req_url_path_append("api/v1/labs", "${LAB}", path) |>
    req_auth_bearer_token(Sys.getenv("EPICYCLE_TOKEN"))
}
editions <- api("editions") |> req_url_query(state = "approved") |> req_perform() |> resp_body_json()
sapply(editions$items, function(e) paste(e$spaceName, e$number))`,
  },
  {
    task: 'Make a pack job and poll it (a write token)',
    curl: `curl -s -X POST -H "Authorization: Bearer $EPICYCLE_TOKEN" -H "Content-Type: application/json" \\
  -d '{"displayProfileId": "'$PROFILE_ID'", "render": ${RENDER_JSON}}' \\
  "$EPICYCLE_URL/api/v1/labs/${LAB}/spaces/$SPACE_ID/editions/1/packs" | jq -r .id
curl -s -H "Authorization: Bearer $EPICYCLE_TOKEN" "$EPICYCLE_URL/api/v1/labs/${LAB}/packs/$PACK_ID" | jq '{state, progress, error}'`,
    r: `pack <- api(sprintf("spaces/%s/editions/%d/packs", space_id, 1)) |>
  req_body_json(list(displayProfileId = profile_id, render = list(sizeDeg = 4, sizeMeasure = "equal-area-diameter",
    canvasDeg = 6, style = "silhouette", strokeArcmin = NULL, fill = 0, background = 128, antiAlias = TRUE,
    transparent = FALSE, samples = 512))) |>
  req_perform() |> resp_body_json()
while (pack$state %in% c("queued", "running")) {
  Sys.sleep(2)
  pack <- api(paste0("packs/", pack$id)) |> req_perform() |> resp_body_json()
}`,
  },
  {
    task: 'Download the pack and verify it',
    curl: `URL=$(curl -s -X POST -H "Authorization: Bearer $EPICYCLE_TOKEN" \\
  "$EPICYCLE_URL/api/v1/labs/${LAB}/packs/$PACK_ID/download-link" | jq -r .url)
curl -sL -o pack.zip "$URL" && unzip -q pack.zip -d pack && (cd pack && sha256sum -c SHA256SUMS)`,
    r: `link <- api(paste0("packs/", pack$id, "/download-link")) |> req_method("POST") |> req_perform() |> resp_body_json()
request(link$url) |> req_perform(path = "pack.zip")
stopifnot(tolower(digest::digest(file = "pack.zip", algo = "sha256")) == pack$sha256)`,
  },
  {
    task: "Fetch a study's trials as CSV",
    curl: `curl -s -H "Authorization: Bearer $EPICYCLE_TOKEN" -o trials.csv \\
  "$EPICYCLE_URL/api/v1/labs/${LAB}/studies/$STUDY_ID/trials/csv"`,
    r: `trials <- api(sprintf("studies/%s/trials/csv", study_id)) |> req_perform() |> resp_body_string()
trials <- read.csv(text = trials)
table(trials$directionDeg, trials$responseKey)`,
  },
];

/** One whole Python script (requests): approved editions → a pack job, polled → the zip downloaded and checked. */
export const PYTHON_EXAMPLE = `import hashlib
import os
import time

import requests

BASE = os.environ.get("EPICYCLE_URL", "http://127.0.0.1:3000")
LAB = os.environ.get("EPICYCLE_LAB", "${LAB}")
session = requests.Session()
session.headers["Authorization"] = "Bearer " + os.environ["EPICYCLE_TOKEN"]


def call(method, path, **kwargs):
    r = session.request(method, f"{BASE}/api/v1/labs/{LAB}{path}", timeout=60, **kwargs)
    if not r.ok:
        raise SystemExit(f"{method} {path}: {r.status_code} {r.json().get('detail')}")
    return r.json()


# 1. The approved editions
edition = call("GET", "/editions", params={"state": "approved"})["items"][0]
print("edition", edition["spaceName"], edition["number"], edition["contentHash"])

# 2. A pack job (a write token), polled until it ends
profile = call("GET", "/display-profiles")["items"][0]
render = {"sizeDeg": 4, "sizeMeasure": "equal-area-diameter", "canvasDeg": 6, "style": "silhouette",
          "strokeArcmin": None, "fill": 0, "background": 128, "antiAlias": True, "transparent": False,
          "samples": 512}
pack = call("POST", f"/spaces/{edition['spaceId']}/editions/{edition['number']}/packs",
            json={"displayProfileId": profile["id"], "render": render})
while pack["state"] in ("queued", "running"):
    time.sleep(2)
    pack = call("GET", f"/packs/{pack['id']}")
if pack["state"] != "succeeded":
    raise SystemExit(f"the pack {pack['state']}: {pack['error']}")

# 3. The zip, downloaded through a short-lived link and checked against its SHA-256
link = call("POST", f"/packs/{pack['id']}/download-link")["url"]
data = requests.get(link, timeout=300).content
if hashlib.sha256(data).hexdigest() != pack["sha256"]:
    raise SystemExit("the download does not match the pack's SHA-256")
with open(f"pack-{pack['sha256'][:8]}.zip", "wb") as f:
    f.write(data)
print("pack", pack["id"], len(data), "bytes, SHA-256 verified")
`;
