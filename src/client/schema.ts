// Generated from openapi/openapi.json by `npm run openapi` (openapi-typescript). Do not edit.
export interface paths {
    "/healthz": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Liveness */
        get: operations["getHealth"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/metrics": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Prometheus text exposition: requests, durations, cache, worker pool and job counters (needs an API key or METRICS_TOKEN when keys are configured) */
        get: operations["getMetrics"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/problems/{code}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** What an error code means: its HTTP status, title and meaning (the `type` of every problem document points here) */
        get: operations["getProblemType"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/readyz": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Readiness: 200 when the service takes requests; 503 while closing, overloaded, or when a dependency (the job queue and its Redis) does not answer */
        get: operations["getReadiness"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/batch": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Many scenarios of any kind in one call, answered as NDJSON in input order
         * @description Each item names an endpoint (kind) and carries the body that endpoint takes (request). The answer is application/x-ndjson, streamed while the items are solved (up to BATCH_CONCURRENCY at a time, default 4): one line per item, in input order, {"index","id","kind","status","scenarioHash","answer"} for an answer or {"index","id","kind","status","problem"} for a problem. A line's answer is byte for byte the JSON the endpoint answers for that request alone, and comes from the same cache; a line's problem is the problem the endpoint answers. One bad item (400, 406, 422, 500) never spoils the others: the status of the whole answer is 200. An item may ask for any format its endpoint has (format csv, oem, geojson, svg): its line then carries format, mediaType and the product (answer for GeoJSON, product as a JSON string for text). Inside a batch tracks hold at most BATCH_MAX_TRACK_SAMPLES samples (default 10000) and an answer at most BATCH_MAX_ANSWER_BYTES (default 4 MiB). The whole body is refused (400) only when it is not a list of items of the known kinds, or (422 limit-exceeded) when it holds more than BATCH_MAX_ITEMS items (default 1000).
         */
        post: operations["runBatch"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/bodies": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Built-in central bodies
         * @description GM, radius, J2, rotation rate and flattening of each built-in body, each value with its published source.
         */
        get: operations["listBodies"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/central-force": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * General central force: effective potential, turning points, circular orbits, radial period, apsidal angle, track (JSON, or SVG plots of U_eff and r(phi))
         * @description Analyses motion in U(r) = sum of terms through U_eff = U + l^2 / (2 m r^2). Works in any consistent unit system (numbers are used as given); angles in the answer (apsidalAngle, precessionPerOrbit, track phi) are degrees. An energy below every value of U_eff answers 422 energy-below-minimum; parameters outside their physical range that the schema cannot see answer 422 invalid-parameter.
         */
        post: operations["solveCentralForce"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/eclipses": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Eclipses: penumbra and umbra entry and exit, depth, beta angle, node local time of sun-synchronous orbits (JSON, CSV or an SVG timeline)
         * @description Searches the window for every interval in which the spacecraft sees the solar disc partly or wholly hidden by the Earth (conical shadow, spherical Earth of the equatorial radius, spherical Sun; Montenbruck & Gill 2000 sec. 3.4.2), and by the Moon when asked. Entries and exits are refined to 0.01 s; an eclipse shorter than the scan step is not missed. No atmosphere: real sunlight fades over a few seconds around the computed entry.
         */
        post: operations["findEclipses"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/jobs": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Your jobs, newest first, a page at a time
         * @description Every job you submitted that is still kept (JOB_RESULT_TTL_S), whatever its status: failed jobs stay here with their reason (the dead letters) until they expire. Pass `next` as `cursor` for the older page.
         */
        get: operations["listJobs"];
        put?: never;
        /**
         * Queue a batch to run later; poll its status, then read its NDJSON results
         * @description Takes the same items as POST /v1/batch (plus an optional label, deadline and compareTo) and answers 202 at once with the job id and a Location header. The job runs the items exactly as POST /v1/batch does and keeps the lines for GET /v1/jobs/{id}/results for JOB_RESULT_TTL_S (default 7 days). Without REDIS_URL jobs run in the service process one at a time and live in memory (at most JOBS_MAX_KEPT, default 100; lost on restart); with REDIS_URL they are BullMQ jobs run by separate queue workers, survive restarts, and a job whose worker dies resumes on another one after the lines already stored. With an Idempotency-Key header (1 to 200 visible ASCII characters), the same key with the same body answers the job stored first (202, its current status); the same key with another body answers 409 idempotency-conflict. When the queue cannot take the job the answer is 503 queue-unavailable with Retry-After.
         */
        post: operations["submitJob"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/jobs/{id}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Status of a job: queued, running, done, failed or cancelled, with counts, progress and timestamps */
        get: operations["getJob"];
        put?: never;
        post?: never;
        /**
         * Cancel a queued or running job
         * @description A queued job never starts; a running one stops after the items being solved. The lines written before stay readable (results, results/{index}). A job already done, failed or cancelled answers 409 job-finished.
         */
        delete: operations["cancelJob"];
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/jobs/{id}/archive": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Every item's product of a done (or cancelled) job as one .tar.gz, with a manifest
         * @description A gzip-compressed tar (POSIX ustar) holding job-<id>/manifest.json (the job; per item its index, id, kind, status, scenario hash, format, media type, file name and size) and one file per item in input order: <index>-<item id or kind>.<format> (json, csv, oem, geojson, svg) for an answered item, <index>-<item id or kind>.problem.json for a failed one (item ids are reduced to letters, digits, ".", "_", "-" and 60 characters). The products are the endpoints' own bytes. Bounded: the files together hold at most JOB_ARCHIVE_MAX_BYTES (default 512 MiB) before compression, else 422 limit-exceeded (read the items one by one: results/{index}). A queued or running job answers 409 job-not-done with Retry-After; a failed one 409 with the reason.
         */
        get: operations["getJobArchive"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/jobs/{id}/changes": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * What moved since the earlier job (compareTo), item by item, as NDJSON
         * @description For a done job submitted with compareTo: one line per item, matched with the earlier job's item of the same id. change "passes": per station the passes that appeared, vanished, or moved by more than thresholdSeconds (AOS, TCA or LOS) or thresholdDegrees (maximum elevation); change "track": the largest position difference, km, over the sample epochs both tracks share; "unchanged", "status" (the item answered differently: a problem on one side), "new-item" (no such id before) or "not-compared" (no id, another kind, or a kind that is not compared).
         */
        get: operations["getJobChanges"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/jobs/{id}/results": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * The NDJSON lines of a done job, in input order (the same lines as POST /v1/batch)
         * @description A done job has all its lines; a cancelled one the lines written before it stopped. While it is queued or running the answer is 409 job-not-done with Retry-After (a partial file of a running job is never served); a failed job answers 409 with the reason (its lines written stay readable one by one, results/{index}).
         */
        get: operations["getJobResults"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/jobs/{id}/results/{index}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * One item of a job, as soon as it is written: its product in its own media type (CSV, OEM, GeoJSON, SVG), or its line (JSON)
         * @description For an item that asked for a format other than JSON and was answered, the default answer (no Accept, or an Accept that prefers it) is the product itself, byte for byte what the endpoint answers alone, with the item's scenario hash as ETag; `Accept: application/json` answers the item's line instead. For a JSON item, and for an item that failed, the answer is its line (application/json), the same bytes as in the NDJSON results.
         */
        get: operations["getJobItem"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/orbit": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /** Solve an orbit: elements, apsides, period, energy, angular momentum, J2 rates (JSON or SVG) */
        post: operations["solveOrbit"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/passes": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Ground-station passes: AOS, TCA, LOS, maximum elevation, azimuths, optional pointing and Doppler (JSON or SVG)
         * @description Searches the window for every interval in which the spacecraft is above each station's elevation limit and horizon mask. AOS/LOS are refined to better than 0.1 s and TCA by maximisation. Geometric elevations unless refraction (radio or optical) is asked. Pass predictions do not grant a licence to transmit: radio transmission needs licensing and frequency coordination.
         */
        post: operations["findPasses"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/results/{scenarioHash}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * A stored answer by its scenario hash, in the format it was first sent in (JSON, CSV, OEM, GeoJSON or SVG)
         * @description Returns the answer stored under the hash, with the media type it was first sent with. Answers live as long as the cache has room for them (in-process LRU bounded in bytes, and the shared Redis tier when configured): a 404 means compute it again by sending the scenario. With API keys, a key reads only the scenarios it has sent (alone, or in a batch or job); others answer 404 as if not stored.
         */
        get: operations["getResult"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/track": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Propagate an orbit over a time grid (JSON, CSV, CCSDS OEM, GeoJSON ground track or SVG ground-track map)
         * @description Samples the orbit at each epoch of the grid with the chosen model and reports, in diagnostics, the drift of the integrals its dynamics conserve (none for drag, third bodies and radiation pressure). Answers stream; at most MAX_TRACK_SAMPLES samples (default 100000), beyond that a 422 names the maximum. Accuracy degrades with the propagation span and the model chosen: two-body ignores every perturbation.
         */
        post: operations["propagateTrack"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/two-body": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Two-body reduction: barycentre, reduced mass, relative orbit, each body's orbit about the barycentre
         * @description Masses in kg or as GM (km^3/s^2), converted with G (CODATA 2018); the relative orbit is answered as POST /v1/orbit answers it. With `track`, both bodies' tracks about the barycentre are appended (at most MAX_TRACK_SAMPLES samples, default 100000; beyond that a 422 names the maximum). Point masses: the bodies have no radius and no collision is detected.
         */
        post: operations["reduceTwoBody"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
}
export type webhooks = Record<string, never>;
export interface components {
    schemas: {
        /** @description One scenario of the batch */
        BatchItem: {
            /** @description Your name for the item, echoed in its line (null when not given); need not be unique */
            id?: string;
            /**
             * @description Which endpoint answers the item: orbit -> POST /v1/orbit, two-body, central-force, track, passes, eclipses likewise
             * @enum {string}
             */
            kind: "orbit" | "two-body" | "central-force" | "track" | "passes" | "eclipses";
            /** @description The JSON body of that endpoint, exactly as it would be sent alone (same fields, units and defaults). It is validated when the item runs: an invalid request becomes that line's 400 problem. A request may name any format its endpoint has (format: csv, oem, geojson, svg): the line then carries the product (see the line's format, mediaType and product). Tracks (track grid, two-body track grid, central-force track samples) hold at most BATCH_MAX_TRACK_SAMPLES samples (default 10000), else 422 too-many-samples */
            request: {
                [key: string]: unknown;
            };
        };
        /** @description One line of the application/x-ndjson answer: one per item, in input order, each a JSON object ending with a newline */
        BatchLine: {
            /** @description With status 200 and a JSON product (JSON, GeoJSON): exactly the JSON the endpoint answers for this request alone (same fields, same bytes) */
            answer?: unknown;
            /** @description With status 200, when the request named a format other than json (csv, oem, geojson, svg): that format */
            format?: string;
            /** @description The item's id, or null */
            id: string | null;
            /** @description Position of the item in the request, from 0; lines come in this order */
            index: number;
            /**
             * @description The item's kind
             * @enum {string}
             */
            kind: "orbit" | "two-body" | "central-force" | "track" | "passes" | "eclipses";
            /** @description With format: the media type the endpoint answers that format with (e.g. text/csv; charset=utf-8; header=present) */
            mediaType?: string;
            /** @description Otherwise: the RFC 9457 problem the endpoint answers for this request alone */
            problem?: components["schemas"]["Problem"];
            /** @description With status 200 and a text product (CSV, CCSDS OEM, SVG): the endpoint's answer for this request alone as one JSON string (decoded, the same bytes); GET /v1/jobs/{id}/results/{index} serves it in its own media type */
            product?: string;
            /** @description With status 200 (and with 422 limit-exceeded for an answer too big for a line): the item's scenario hash; GET /v1/results/{scenarioHash} serves the answer while it is cached */
            scenarioHash?: string;
            /** @description The HTTP status the endpoint answered for this item alone: 200, or the problem's status (400, 406, 422, 503, 500) */
            status: number;
        };
        /** @description Many scenarios of any kind in one call */
        BatchRequest: {
            /** @description The scenarios, 1 to BATCH_MAX_ITEMS (default 1000; more answers 422 limit-exceeded); the whole body is also bounded by BODY_LIMIT_BYTES */
            items: components["schemas"]["BatchItem"][];
        };
        BodiesAnswer: {
            bodies: {
                flattening: number | null;
                /** @description GM, km^3/s^2 */
                gm: number;
                /** @description Mean motion about the Sun, deg/day (sun-synchronous test) */
                heliocentricMeanMotionDegPerDay: number | null;
                /** @description J2, dimensionless */
                j2: number | null;
                name: string;
                /** @description Mean equatorial radius, km */
                radius: number | null;
                /** @description Sidereal rotation rate, deg/day */
                rotationRateDegPerDay: number | null;
                /** @description Published source of each value, by field name (the publication, and its table or constant where it has one; "from memory" marks a value not checked against it) */
                sources: {
                    [key: string]: string;
                };
            }[];
        };
        CatalogueMeanElements: {
            /** @description deg */
            argPeriapsis: number;
            /** @description B* drag term, 1/earth radii */
            bstar: number;
            /** @description Catalogue number as written */
            catalogId: string;
            /** @description Catalogue number (Alpha-5 decoded: A = 10 ... Z = 33) */
            catalogNumber: number;
            classification: string | null;
            eccentricity: number;
            elementSetNumber: number | null;
            /**
             * @description Element epoch, UTC
             * @example 2026-12-01T00:00:00.000000Z
             */
            epoch: string;
            /** @enum {string} */
            format: "tle" | "omm";
            /** @description deg, TEME */
            inclination: number;
            internationalDesignator: string | null;
            /** @description deg */
            meanAnomaly: number;
            /** @description Kozai mean motion as given, deg/s */
            meanMotion: number;
            /** @description second derivative of the mean motion divided by 6, rev/day^3 (as given; SGP4 does not use it) */
            meanMotionDdot: number;
            /** @description first derivative of the mean motion divided by 2, rev/day^2 (as given; SGP4 does not use it) */
            meanMotionDot: number;
            name: string | null;
            /** @description deg, TEME */
            raan: number;
            /**
             * @description near-earth (SGP4, period under 225 min) or deep-space (SDP4, with lunar-solar terms and resonances)
             * @enum {string}
             */
            regime: "near-earth" | "deep-space";
            /** @description revolution number at epoch */
            revolutionNumber: number | null;
            /** @description The same mean motion in rev/day, as the formats give it */
            revolutionsPerDay: number;
            /** @description Brouwer mean semi-major axis, km (WGS-72 earth radii x 6378.135), as the method derives it: not osculating */
            semiMajorAxis: number;
            /**
             * @description The mean-element theory: SGP4 (Vallado et al. 2006, WGS-72 constants)
             * @constant
             */
            theory: "SGP4";
        };
        /**
         * @description The central body: a built-in name (default "earth") or an object with gm and optionally radius, j2, rotationRateDegPerDay, flattening
         * @default earth
         */
        CentralBody: ("sun" | "mercury" | "venus" | "earth" | "moon" | "mars" | "jupiter" | "saturn" | "uranus" | "neptune") | components["schemas"]["CustomBody"];
        CentralForceAnswer: {
            /** @description Every interval of r where E >= U_eff, ascending */
            allowedRegions: {
                /** @description Inner end, length unit (0 at the centre) */
                inner: number;
                /**
                 * @description What ends the region: r = 0, a turning point E = U_eff, an unstable circular orbit approached only asymptotically (E at the top of a barrier), or infinity
                 * @enum {string}
                 */
                innerEnd: "centre" | "turning-point" | "unstable-circular-orbit" | "infinity";
                /**
                 * @description bound: between two turning points (or a turning point and an unstable circular orbit); unbound: reaches infinity; captured: reaches r = 0 (with l = 0 a fall along a line through the centre); circular: E equals the energy of a stable circular orbit
                 * @enum {string}
                 */
                motion: "bound" | "unbound" | "captured" | "circular";
                /** @description Outer end, length unit; null when the region extends to infinity */
                outer: number | null;
                /**
                 * @description What ends the region: r = 0, a turning point E = U_eff, an unstable circular orbit approached only asymptotically (E at the top of a barrier), or infinity
                 * @enum {string}
                 */
                outerEnd: "centre" | "turning-point" | "unstable-circular-orbit" | "infinity";
            }[];
            /** @description Index in allowedRegions of the region described below: the one holding initial.radius, else the outermost */
            analysedRegion: number;
            /** @description l, as given or m r v_t from initial; mass x length^2 / time */
            angularMomentum: number;
            /** @description Outer end of the analysed region, length unit; null when the motion reaches infinity */
            apoapsis: number | null;
            /** @description Angle swept from periapsis to apoapsis, degrees (180 for a Kepler ellipse, 90 for the isotropic oscillator; circular: the near-circular limit); null when radialPeriod is null or the motion is rectilinear */
            apsidalAngle: number | null;
            /** @description Every radius where dU_eff/dr = 0, ascending */
            circularOrbits: {
                /** @description |l| / (m r^2), radians per time unit */
                angularFrequency: number;
                /** @description Apsidal angle of near-circular orbits about this one, 180 / frequencyRatio, degrees; null when unstable or l = 0 */
                apsidalAngle: number | null;
                /** @description U_eff at that radius: the energy of the circular orbit with this l, energy unit */
                energy: number;
                /** @description radialFrequency / angularFrequency; null when unstable or l = 0 */
                frequencyRatio: number | null;
                /** @description Small-oscillation radial angular frequency sqrt(U_eff'' / m), radians per time unit; null when unstable */
                radialFrequency: number | null;
                /** @description Radius where dU_eff/dr = 0, length unit */
                radius: number;
                /** @description d2U_eff/dr2 > 0 (a minimum of U_eff) */
                stable: boolean;
            }[];
            /** @description Samples around the analysed region, ascending in r */
            effectivePotential: {
                /** @description Radius, length unit */
                r: number;
                /** @description U(r), energy unit */
                u: number;
                /** @description U_eff(r) = U(r) + l^2 / (2 m r^2), energy unit */
                uEff: number;
            }[];
            /** @description E, as given or from initial; energy unit */
            energy: number;
            /** @description m as given, mass unit */
            mass: number;
            /**
             * @description bound: between two turning points (or a turning point and an unstable circular orbit); unbound: reaches infinity; captured: reaches r = 0 (with l = 0 a fall along a line through the centre); circular: E equals the energy of a stable circular orbit
             * @enum {string}
             */
            motion: "bound" | "unbound" | "captured" | "circular";
            /** @description Inner end of the analysed region, length unit; null when the motion reaches the centre */
            periapsis: number | null;
            /** @description 2 apsidalAngle - 360: advance of the periapsis per radial period, degrees (0 for a closed Kepler ellipse; negative: the periapsis regresses); null when apsidalAngle is null */
            precessionPerOrbit: number | null;
            /** @description Time from periapsis to apoapsis and back, time unit (circular: 2 pi / radialFrequency); null when the radial motion is not periodic (unbound, captured, or a region ending at an unstable circular orbit, approached only asymptotically) */
            radialPeriod: number | null;
            /** @description l = 0: motion along a line through the centre (no apsidal angle) */
            rectilinear: boolean;
            /**
             * @description How the sample radii are spaced (log when they span more than a factor 20)
             * @enum {string}
             */
            sampleSpacing: "linear" | "log";
            /** @description SHA-256 (hex) of the normalised scenario and the solver version; also the ETag */
            scenarioHash: string;
            /** @description r(t), phi(t) when the request asked for a track, else null */
            track: {
                /** @description m rDot^2 / 2 + U_eff(r) of the start state, energy unit */
                energy: number;
                /** @description Largest |E(t_i) - E(t_0)| over the samples, energy unit (integration error) */
                energyDrift: number;
                /** @description energyDrift over the energy scale at the start (|E| plus the magnitudes of all parts of U_eff), dimensionless */
                energyDriftRelative: number;
                /** @description The motion fell to the centre (r below 1e-6 of the start radius) and the track ends there, with fewer samples than asked */
                reachedCentre: boolean;
                /** @description Number of samples (fewer than asked when the motion reached the centre) */
                sampleCount: number;
                samples: {
                    /** @description Polar angle from the start, degrees, unwrapped (grows with the sense of l) */
                    phi: number;
                    /** @description Radius, length unit */
                    r: number;
                    /** @description dr/dt, length / time unit */
                    rDot: number;
                    /** @description Time from the start, time unit */
                    t: number;
                }[];
                /**
                 * @description Where the track starts
                 * @enum {string}
                 */
                start: "initial" | "periapsis" | "apoapsis";
            } | null;
            /** @description Every radius where E = U_eff, ascending, in all regions; length unit */
            turningPoints: number[];
            /** @description The unit labels of the request (no conversion is made) */
            units: {
                energy: string;
                radius: string;
            };
        };
        /**
         * @description Motion of a mass in a central potential U(r) built from terms, analysed through the effective potential U_eff = U + l^2 / (2 m r^2). Any consistent unit system: the numbers are used as given (no km or degree conversion), so lengths, masses, times and energies must all come from one system. Angles in the answer are degrees.
         * @example {
         *       "mass": 1,
         *       "potential": {
         *         "terms": [
         *           {
         *             "kind": "power",
         *             "coefficient": -1,
         *             "exponent": -1
         *           },
         *           {
         *             "kind": "power",
         *             "coefficient": -0.002,
         *             "exponent": -3
         *           }
         *         ]
         *       },
         *       "angularMomentum": 1.2,
         *       "energy": -0.3,
         *       "track": {
         *         "periods": 2,
         *         "samples": 101
         *       }
         *     }
         */
        CentralForceRequest: {
            /** @description l = m r^2 dphi/dt, mass x length^2 / time; its sign is the sense of rotation; 0 is motion on a line through the centre. Give with energy, or give initial */
            angularMomentum?: number;
            /** @description E = m (dr/dt)^2 / 2 + U_eff(r), energy unit. Give with angularMomentum, or give initial */
            energy?: number;
            /**
             * @description json (the analysis) | svg (a plot of U_eff, U, the energy level, turning points and circular orbits; with a track, the path r(phi)). Without it the Accept header chooses (application/json, image/svg+xml); default json
             * @enum {string}
             */
            format?: "json" | "svg";
            /** @description Instead of angularMomentum and energy: a state, giving l = m r v_t and E = m (v_r^2 + v_t^2) / 2 + U(r). It also chooses the allowed region analysed (the one holding this radius) and the start of the track */
            initial?: {
                /** @description dr/dt at the start, length / time unit; negative moves inward */
                radialVelocity: number;
                /** @description Initial distance r from the centre, length unit (> 0) */
                radius: number;
                /** @description r dphi/dt at the start, length / time unit; its sign is the sense of rotation */
                tangentialVelocity: number;
            };
            /** @description m, mass unit (> 0): the moving mass, or the reduced mass m1 m2 / (m1 + m2) of a two-body system */
            mass: number;
            /** @description The potential energy U(r) of the central force F = -dU/dr */
            potential: {
                /** @description U(r) is the sum of these terms (1 to 32), energy unit */
                terms: components["schemas"]["PotentialTerm"][];
            };
            /** @description Largest sampled radius, length unit (default: chosen around the turning points and circular orbits) */
            rMax?: number;
            /** @description Smallest sampled radius, length unit (default: chosen around the turning points and circular orbits) */
            rMin?: number;
            /**
             * @description Number of effective-potential samples, 2 to 10000 (default 400); samples where U is not finite are left out
             * @default 400
             */
            samples?: number;
            /** @description Ask for r(t), phi(t) integrated from the radial equation m r'' = -dU_eff/dr with phi' = l / (m r^2); the JSON answer then carries it, the SVG answer adds the path r(phi) in the plane */
            track?: {
                /** @description Length of the track, time unit; negative integrates backward. Give this or periods */
                duration?: number;
                /** @description Length of the track in radial periods (> 0; only for bound or circular motion, else 422 no-radial-period). Give this or duration */
                periods?: number;
                /**
                 * @description Equally spaced samples including both ends, 2 to 100000 (default 201; the service limit MAX_TRACK_SAMPLES also applies)
                 * @default 201
                 */
                samples?: number;
                /**
                 * @description Where the track starts (t = 0, phi = 0): the initial state (default when given; needs initial), else the periapsis (default) or apoapsis of the analysed region
                 * @enum {string}
                 */
                start?: "initial" | "periapsis" | "apoapsis";
            };
            /**
             * @description Labels only, for the SVG axes and echoed in the JSON answer; no conversion is made
             * @default {
             *       "radius": "consistent units",
             *       "energy": "consistent units"
             *     }
             */
            units?: {
                /**
                 * @description Label of the energy unit on the plot's U_eff axis
                 * @default consistent units
                 */
                energy?: string;
                /**
                 * @description Label of the length unit on the plot's r axis
                 * @default consistent units
                 */
                radius?: string;
            };
        };
        /** @description A central body given by its constants */
        CustomBody: {
            /** @description Flattening f = (a - b)/a */
            flattening?: number;
            /** @description Gravitational parameter GM, km^3/s^2 */
            gm: number;
            /** @description Unnormalised second zonal harmonic J2 (dimensionless) */
            j2?: number;
            /**
             * @description A label for the body, echoed in answers
             * @default custom
             */
            name: string;
            /** @description Mean equatorial radius, km (needed for altitudes, impact checks and J2) */
            radius?: number;
            /** @description Sidereal rotation rate, deg/day (the rate of the prime-meridian angle W, as the IAU WGCCRE tables give it) */
            rotationRateDegPerDay?: number;
        };
        /** @description With EOP_FILE set, on answers whose computation used the Earth orientation: the table used */
        EarthOrientationDiagnostics: {
            /** @description First day of the table (UTC date) */
            firstDate: string;
            /** @description Last day whose polar motion and UT1-UTC are observed (IERS flag I); later rows are predictions */
            lastObservedDate: string | null;
            /** @description Last day of the table */
            lastPredictedDate: string;
            /** @description Some epoch of the answer lies outside the table: there polar motion, dX, dY (and UT1-UTC unless given) are 0 */
            outsideTable: boolean;
            /** @description Some epoch of the answer used predicted rows */
            predicted: boolean;
            /**
             * @description The IERS finals2000A table of the service (EOP_FILE)
             * @constant
             */
            source: "EOP_FILE";
            /** @description SHA-256 of the table's rows: part of the scenario hash, so an answer of another table is never served */
            tableDigest: string;
            /**
             * @description Where UT1-UTC came from: the request's ut1MinusUtc, or the table
             * @enum {string}
             */
            ut1MinusUtc: "request" | "table";
            /** @description With outsideTable: which epochs, and what was taken there */
            warning?: string;
        };
        Eclipse: {
            /** @description Largest fraction of the solar disc hidden, 0 to 1 (1 when the umbra is reached); a uniformly bright disc */
            depth: number;
            /** @description s, start to stop */
            duration: number;
            /** @description Still in shadow at the window stop: stop is the window stop */
            endsAfterWindow: boolean;
            /**
             * @description Penumbra entry: the first point of the solar disc is hidden (or the window start)
             * @example 2026-12-01T00:00:00.000000Z
             */
            start: string;
            /** @description Already in shadow at the window start: start is the window start */
            startsBeforeWindow: boolean;
            /**
             * @description Penumbra exit: the whole solar disc is seen again (or the window stop)
             * @example 2026-12-01T00:00:00.000000Z
             */
            stop: string;
            /** @description s, umbraStart to umbraStop (null when partial only) */
            umbraDuration: number | null;
            /** @description Umbra entry: the whole solar disc is hidden (null when the eclipse is partial only) */
            umbraStart: string | null;
            /** @description Umbra exit (null when the eclipse is partial only) */
            umbraStop: string | null;
        };
        EclipsesAnswer: {
            /** @description h, [0, 24): local mean solar time of the ascending node at the window start; null unless sunSynchronous */
            ascendingNodeLocalTime: number | null;
            /** @description Beta angle of the osculating orbit plane */
            beta: {
                /** @description deg: greatest beta over the scan samples of the window */
                max: number;
                /** @description deg: least beta over the scan samples of the window */
                min: number;
                /** @description deg: the Sun's elevation above the orbit plane at the window start (positive on the side of the angular momentum) */
                start: number;
            };
            /** @description s: the scan step sized from the orbit so that no eclipse is missed, even one shorter than the step */
            coarseStep: number;
            diagnostics?: components["schemas"]["SearchDiagnostics"];
            /** @description The Earth's shadow, in time order */
            eclipses: components["schemas"]["Eclipse"][];
            /** @enum {string} */
            model: "two-body" | "j2-secular" | "j2-analytic" | "numerical" | "ephemeris" | "sgp4";
            /** @description The Moon's shadow, in time order; null unless moon was asked */
            moonEclipses: components["schemas"]["Eclipse"][] | null;
            propagationStopped?: components["schemas"]["PropagationStopped"];
            /** @description SHA-256 (hex) of the normalised scenario and the solver version; also the ETag */
            scenarioHash: string;
            /** @description The shadow model and the Sun used, in words */
            shadow: string;
            /** @description At the window start, the osculating orbit's first-order J2 node rate follows the mean Sun (within the tolerance of /v1/orbit) */
            sunSynchronous: boolean;
            window: {
                /**
                 * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                start: string;
                /**
                 * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                stop: string;
            };
        };
        /** @description A spacecraft and a window */
        EclipsesRequest: {
            centralBody?: components["schemas"]["CentralBody"];
            elements?: components["schemas"]["InitialElements"];
            ephemeris?: components["schemas"]["EphemerisOrbit"];
            /**
             * @description Forces of the numerical model, each kind at most once (ignored by the analytic models)
             * @default []
             */
            forces?: components["schemas"]["Force"][];
            /**
             * @description json | csv (RFC 4180, one row per eclipse, Earth and Moon together in time order) | svg (a timeline of sunlight, penumbra and umbra, one row per UTC day). Without it the Accept header chooses (application/json, text/csv, image/svg+xml); default json
             * @enum {string}
             */
            format?: "json" | "csv" | "svg";
            /**
             * @description Default: sgp4 for a tle or omm orbit, ephemeris for an ephemeris orbit, two-body otherwise. ephemeris: the given OEM interpolated (the only model of an ephemeris orbit, and only for one; see ephemeris.oem); never extrapolated. sgp4: the SGP4/SDP4 method (Vallado et al. 2006, WGS-72) from the catalogue mean elements, for tle and omm orbits only; the other models start from the SGP4 state at the element epoch (mean elements are not osculating: they are converted by SGP4 first). two-body: exact Keplerian motion (universal variables), no perturbations. j2-secular: Keplerian motion in mean elements (averaged over one revolution of the mean orbit) whose node, periapsis and mean anomaly drift at the first-order secular J2 rates, J2 about the frame z axis; bound orbits about a body with J2; short-period J2 terms left out (bounded error of 1 to 9 km at the first sample, up to ~25 km over a day, measured; see docs/accuracy.md). j2-analytic: Brouwer (1959) J2 theory with the short-period terms in Lyddane's (1963) form: mean elements (the given state inverted, so the first sample is the given state) drifting at the secular J2 rates to second order, plus the first-order short-period terms, J2 about the same axis as numerical; bound orbits with e < 0.95 about a body with J2; within 0.1 km of numerical J2 over 7 days in LEO and 1.5 km for Molniya and GTO orbits (measured; long-period terms left out, see docs/accuracy.md). numerical: two-body gravity plus `forces`, integrated (extrapolation method, relative tolerance 1e-13)
             * @enum {string}
             */
            model?: "two-body" | "j2-secular" | "j2-analytic" | "numerical" | "sgp4" | "ephemeris";
            /**
             * @description Also search the Moon's shadow (conical, mean lunar radius 1737.4 km); its eclipses are listed apart, in moonEclipses
             * @default false
             */
            moon?: boolean;
            omm?: components["schemas"]["OrbitMeanElementsMessage"];
            state?: components["schemas"]["InitialState"];
            tle?: components["schemas"]["TwoLineElementSet"];
            /** @description UT1 - UTC, s (IERS Bulletin A); when given it wins over the EOP_FILE table, when absent the table gives it (0 without a table; 0 outside the table, with a warning in diagnostics.earthOrientation). Polar motion and dX, dY come from the table whenever it covers the epoch; enters only the local time of the ascending node */
            ut1MinusUtc?: number;
            /** @description Search window (epochs in timeSystem, UTC by default), stop after start, at most 31 days */
            window: {
                /**
                 * @description Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199
                 * @example 2026-12-01T00:00:00Z
                 */
                start: string;
                /**
                 * @description Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199
                 * @example 2026-12-01T00:00:00Z
                 */
                stop: string;
                /**
                 * @description Time system of this part's epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC
                 * @enum {string}
                 */
                timeSystem?: "UTC" | "TAI" | "TT" | "GPS";
            };
        };
        Elements: {
            /** @description deg; 0 by convention when circular (argPeriapsisDefined false); measured from the x axis when equatorial */
            argPeriapsis: number;
            argPeriapsisDefined: boolean;
            /** @description deg, u = argPeriapsis + trueAnomaly */
            argumentOfLatitude: number;
            /** @description Eccentric anomaly E in deg (ellipse); hyperbolic anomaly H expressed in deg (hyperbola); for a parabola the parabolic anomaly B = tan(nu/2), dimensionless (Vallado 4th ed. sec. 2.2) */
            eccentricAnomaly: number;
            eccentricity: number;
            /** @description deg */
            inclination: number;
            /** @description deg, raan + argPeriapsis */
            longitudeOfPeriapsis: number;
            /** @description Mean anomaly M in deg (ellipse); hyperbolic mean anomaly M_h = e sinh H - H expressed in deg (hyperbola); for a parabola M_p = B + B^3/3, dimensionless */
            meanAnomaly: number;
            /** @description deg; 0 by convention when equatorial (raanDefined false) */
            raan: number;
            raanDefined: boolean;
            /** @description km, p = h^2/mu */
            semiLatusRectum: number;
            /** @description km; negative for hyperbolas, null for a parabola */
            semiMajorAxis: number | null;
            /** @description deg; the argument of latitude when circular inclined, the true longitude when circular equatorial */
            trueAnomaly: number;
            /** @description deg, raan + argPeriapsis + trueAnomaly */
            trueLongitude: number;
        };
        /** @description An ephemeris to interpolate (model ephemeris, implied): samples and search windows must lie inside its coverage, else 422 outside-coverage naming the coverage; it is never extrapolated */
        EphemerisOrbit: {
            /** @description A CCSDS 502.0-B-3 Orbit Ephemeris Message in KVN (the text of the file, versions 1.0 to 3.0): a header, then one or more segments (META_START ... META_STOP, data lines "epoch x y z x_dot y_dot z_dot [x_ddot y_ddot z_ddot]" in km, km/s, km/s**2, optional covariance blocks, which are skipped). CENTER_NAME EARTH; REF_FRAME GCRF, ICRF, EME2000, ITRF (or a realisation such as ITRF2014; Earth-fixed, velocity relative to the rotating Earth, converted with the request's Earth orientation) or TEME; TIME_SYSTEM UTC, TAI, TT or GPS; INTERPOLATION LAGRANGE, HERMITE (positions with their velocities, and accelerations where the lines give them) or LINEAR, INTERPOLATION_DEGREE 1 to 15 (default 7 for LAGRANGE and when INTERPOLATION is absent, 5 for HERMITE, 1 for LINEAR). Each segment is used over USEABLE_START_TIME .. USEABLE_STOP_TIME (else START_TIME .. STOP_TIME) within its first and last data line; an epoch covered by two segments is taken from the earlier one. At most 1000 segments and 500000 data lines. A malformed message answers 422 oem-malformed, one the service does not read (another centre, frame, time system or method; XML) 422 oem-unsupported, each naming the line */
            oem: string;
        };
        Force: {
            /** @constant */
            kind: "j2";
        } | {
            /** @description m / (Cd A), kg/m^2 */
            ballisticCoefficient: number;
            /** @constant */
            kind: "drag";
        } | {
            /** @enum {string} */
            body: "sun" | "moon";
            /** @constant */
            kind: "third-body";
        } | {
            /** @description A/m, m^2/kg */
            areaToMass: number;
            /** @constant */
            kind: "srp";
            /** @description epsilon in [0, 1]; C_R = 1 + epsilon */
            reflectivity: number;
        };
        GeodeticSample: {
            /** @description ISO 8601 UTC */
            epoch: string;
            /** @description Height above the WGS-84 ellipsoid, km, 6 decimals */
            height: number;
            /** @description Geodetic latitude, deg (WGS-84), 7 decimals */
            latitude: number;
            /** @description Longitude east, deg (-180, 180], 7 decimals */
            longitude: number;
        };
        GroundStation: {
            /** @description Height above the WGS-84 ellipsoid, km */
            altitude: number;
            /** @description Elevation limit by azimuth for terrain and buildings: linear between points, wrapping at 360; never below minElevation */
            horizonMask?: {
                /** @description deg from north through east, [0, 360) */
                azimuth: number;
                /** @description deg: the lowest usable elevation at that azimuth */
                elevation: number;
            }[];
            /** @description Unique within the request; echoed in each pass */
            id: string;
            /** @description Geodetic latitude, deg (WGS-84) */
            latitude: number;
            /** @description Longitude east, deg */
            longitude: number;
            /**
             * @description Elevation limit, deg (default 0)
             * @default 0
             */
            minElevation?: number;
        };
        /** @description Classical orbital elements at an epoch (angles in degrees, distances in km) */
        InitialElements: {
            /** @description Argument of periapsis, degrees (ignored when circular) */
            argPeriapsis: number;
            /** @description Eccentricity e >= 0 (0 circular, < 1 elliptic, 1 parabolic, > 1 hyperbolic) */
            eccentricity: number;
            /**
             * @description Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199
             * @example 2026-12-01T00:00:00Z
             */
            epoch: string;
            /** @description Inclination, degrees [0, 180] */
            inclination: number;
            /** @description Mean anomaly, degrees; for a hyperbola the hyperbolic mean anomaly e sinh H - H expressed in degrees; for a parabola (e = 1) M_p = B + B^3/3 with B = tan(nu/2), dimensionless */
            meanAnomaly?: number;
            /** @description Right ascension of the ascending node, degrees (ignored when equatorial) */
            raan: number;
            /** @description Semi-latus rectum p, km: instead of semiMajorAxis, required when eccentricity = 1 */
            semiLatusRectum?: number;
            /** @description Semi-major axis a, km: positive for ellipses, negative for hyperbolas, |a| <= 1000000000000; omit for a parabola (give semiLatusRectum) */
            semiMajorAxis?: number;
            /**
             * @description Time system of this part's epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC
             * @enum {string}
             */
            timeSystem?: "UTC" | "TAI" | "TT" | "GPS";
            /** @description True anomaly, degrees (give this or meanAnomaly) */
            trueAnomaly?: number;
        };
        /** @description A Cartesian state at an epoch */
        InitialState: {
            /**
             * @description Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199
             * @example 2026-12-01T00:00:00Z
             */
            epoch: string;
            /**
             * @description Frame of the state: gcrf or icrf (inertial, the service's frame: ICRF axes, origin the centre of the body); eme2000 (J2000 mean equator and equinox: the IAU 2006 frame bias is applied, 23 mas); itrf (Earth-fixed, velocity relative to the rotating Earth as GNSS receivers give it; converted at the state's epoch with IAU 2006/2000B precession-nutation, UT1-UTC and, with EOP_FILE, polar motion; centralBody earth only); teme (true equator, mean equinox: the frame of SGP4 output; to PEF by GMST 1982, then as itrf; centralBody earth only)
             * @default gcrf
             * @enum {string}
             */
            frame?: "gcrf" | "icrf" | "eme2000" | "itrf" | "teme";
            /** @description Position [x, y, z] in km, each component within +-1000000000000 */
            position: [
                number,
                number,
                number
            ];
            /**
             * @description Time system of this part's epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC
             * @enum {string}
             */
            timeSystem?: "UTC" | "TAI" | "TT" | "GPS";
            /** @description Velocity [vx, vy, vz] in km/s, each component below the speed of light */
            velocity: [
                number,
                number,
                number
            ];
        };
        /** @description The ephemeris model: how each segment was interpolated and an error estimate */
        InterpolationDiagnostics: {
            /** @description km: the largest estimated interpolation error in position over the epochs computed, from the change the farthest node makes (the last term of Newton's form: the error of the interpolant one node smaller, so it overstates the error of the one used). It says nothing of the errors already in the file's states */
            maxPositionErrorEstimate: number;
            segments: components["schemas"]["SegmentInterpolation"][];
        };
        J2Rates: {
            /** @description Secular argument-of-periapsis rate from J2, deg/day */
            argPeriapsisRate: number;
            /** @description J2 correction to the mean motion, deg/day (added to the Keplerian mean motion) */
            meanAnomalyRate: number;
            /** @description Secular RAAN rate from J2, deg/day */
            raanRate: number;
            /** @description RAAN rate within the tolerance of the body's mean motion about the Sun */
            sunSynchronous: boolean;
            /** @description deg: the inclination that would make this a, e sun-synchronous (null when none does) */
            sunSynchronousInclination: number | null;
        };
        JobAccepted: {
            /** @description The job id (a UUID) */
            id: string;
            links: components["schemas"]["JobLinks"];
            /**
             * @description queued for a new job; with a repeated Idempotency-Key, the status of the job stored first
             * @enum {string}
             */
            status: "queued" | "running" | "done" | "failed" | "cancelled";
        };
        JobAnswer: {
            /** @description Times a worker took the job (more than 1 after a worker stopped under it or a retry; the job resumes after the lines already stored) */
            attempts: number;
            /** @description Where the status is POSTed once the job is done, failed or cancelled, or null */
            callbackUrl: string | null;
            /** @description The earlier job compared with, or null */
            compareTo: string | null;
            counts: {
                /** @description Items whose line is written (answered or failed) */
                done: number;
                /** @description Of those, items whose line carries a problem */
                failed: number;
                /** @description Items in the job */
                items: number;
            };
            /** @description Submission time, ISO 8601 UTC */
            createdAt: string;
            /** @description The deadline given at submission, or null */
            deadline: string | null;
            /** @description Why a failed or cancelled job stopped; null otherwise */
            error: string | null;
            /** @description When it became done, failed or cancelled, ISO 8601 UTC; null before */
            finishedAt: string | null;
            /** @description The job id (a UUID) */
            id: string;
            /** @description The label given at submission, or null */
            label: string | null;
            links: components["schemas"]["JobLinks"];
            progress: {
                /** @description While running: now plus the items left at the rate seen since startedAt, ISO 8601 UTC (an estimate); null otherwise */
                estimatedFinishAt: string | null;
                /** @description counts.done / counts.items */
                fraction: number;
            };
            /** @description When a worker first took it, ISO 8601 UTC; null while queued */
            startedAt: string | null;
            /**
             * @description queued: waiting for a worker; running: items being solved; done: every item has its line (items may have failed: see counts.failed); failed: the job as a whole could not run or missed its deadline (see error; kept, like every finished job, for JOB_RESULT_TTL_S: the dead letters); cancelled: DELETE /v1/jobs/{id} stopped it (the lines written before stay readable)
             * @enum {string}
             */
            status: "queued" | "running" | "done" | "failed" | "cancelled";
        };
        JobLinks: {
            /** @description GET: every item's product as one .tar.gz with a manifest, once the job is done */
            archive: string;
            /** @description GET: with compareTo, what moved since the earlier job (NDJSON) */
            changes: string;
            /** @description GET: the NDJSON results once the job is done */
            results: string;
            /** @description GET: the job status; DELETE: cancel it */
            self: string;
        };
        JobList: {
            /** @description Your jobs, newest first */
            jobs: components["schemas"]["JobAnswer"][];
            /** @description Cursor of the next (older) page: GET /v1/jobs?cursor=...; null on the last page */
            next: string | null;
        };
        /** @description A batch to run later: the same items as POST /v1/batch */
        JobRequest: {
            /** @description http(s) URL: once the job is done, failed or cancelled, its status (the answer of GET /v1/jobs/{id}) is POSTed there as JSON, signed with HMAC-SHA256 under the service's JOB_CALLBACK_SECRET: header apsides-signature = "sha256=" + hex HMAC of "<apsides-signature-timestamp>.<body>"; apsides-delivery is one id per callback (the same on retries). A non-2xx answer, a redirect (never followed) or no answer within JOB_CALLBACK_TIMEOUT_MS is retried JOB_CALLBACK_ATTEMPTS times in all with exponential backoff from JOB_CALLBACK_BACKOFF_MS. Only hosts in JOB_CALLBACK_HOSTS are allowed: any other answers 422 callback-not-allowed */
            callbackUrl?: string;
            /** @description The id of an earlier job of yours: GET /v1/jobs/{id}/changes then lists, item by item (matched by item id), what moved since that job */
            compareTo?: string;
            /**
             * Format: date-time
             * @description ISO 8601 UTC: a job not done by then stops and fails with the reason "deadline" (the lines written stay readable by index); at most JOB_MAX_DEADLINE_S ahead
             */
            deadline?: string;
            /** @description The scenarios, 1 to BATCH_MAX_ITEMS (default 1000; more answers 422 limit-exceeded); the whole body is also bounded by BODY_LIMIT_BYTES */
            items: components["schemas"]["BatchItem"][];
            /** @description Your name for the job, echoed in its status */
            label?: string;
            /**
             * @description With compareTo: a pass whose maximum elevation changed by more than this, degrees, is reported as moved
             * @default 0.1
             */
            thresholdDegrees?: number;
            /**
             * @description With compareTo: a pass whose AOS, LOS or TCA, or an eclipse whose entry or exit (penumbra or umbra), moved by more than this, seconds, is reported as moved
             * @default 1
             */
            thresholdSeconds?: number;
        };
        OrbitAnswer: {
            apsides: {
                /** @description null when unbound */
                apoapsis: {
                    /** @description km above the body radius (null when the body has no radius) */
                    altitude: number | null;
                    /** @description Next passage at or after the epoch (null when it lies in the past on an unbound trajectory, when the orbit is circular, or when it falls after 2199) */
                    nextPassage: string | null;
                    /** @description km from the centre of the body */
                    radius: number;
                    /** @description km/s */
                    speed: number;
                } | null;
                periapsis: {
                    /** @description km above the body radius (null when the body has no radius) */
                    altitude: number | null;
                    /** @description Next passage at or after the epoch (null when it lies in the past on an unbound trajectory, when the orbit is circular, or when it falls after 2199) */
                    nextPassage: string | null;
                    /** @description km from the centre of the body */
                    radius: number;
                    /** @description km/s */
                    speed: number;
                };
            };
            centralBody: {
                flattening: number | null;
                /** @description GM, km^3/s^2 */
                gm: number;
                /** @description J2, dimensionless */
                j2: number | null;
                name: string;
                /** @description Mean equatorial radius, km */
                radius: number | null;
                /** @description Sidereal rotation rate, deg/day */
                rotationRateDegPerDay: number | null;
            };
            /** @description With EOP_FILE set and an Earth-fixed input (itrf state, itrf or teme ephemeris nodes): the Earth orientation used */
            diagnostics?: components["schemas"]["SearchDiagnostics"];
            /** @description dimensionless, points to periapsis */
            eccentricityVector: [
                number,
                number,
                number
            ];
            elements: components["schemas"]["Elements"];
            /** @description tle or omm with ageAt: the age of the element set at that epoch */
            elementSetAge?: {
                /**
                 * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                at: string;
                /** @description days from the element epoch to `at` (negative before it) */
                days: number;
            };
            /**
             * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
             * @example 2026-12-01T00:00:00.000000Z
             */
            epoch: string;
            /** @description deg, angle of the velocity above the local horizontal */
            flightPathAngle: number;
            /** @description true when the periapsis radius is below the body radius (null without a radius) */
            intersectsBody: boolean | null;
            /** @description J2 secular rates (null when the body has no J2 or the orbit is unbound) */
            j2: components["schemas"]["J2Rates"] | null;
            /** @description tle or omm only: the catalogue mean elements as given (units converted). The rest of the answer is osculating, from the SGP4 state at the element epoch rotated to gcrf */
            meanElements?: components["schemas"]["CatalogueMeanElements"];
            /** @description deg/s: mean motion (ellipse), sqrt(mu/-a^3) expressed in deg/s (hyperbola); for a parabola 2 sqrt(mu/p^3) in 1/s, the rate of the dimensionless M_p */
            meanMotion: number;
            /** @enum {string} */
            orbitType: "circular" | "elliptic" | "parabolic" | "hyperbolic";
            /** @description s; null when unbound */
            period: number | null;
            /** @description km at epoch */
            radius: number;
            /** @description SHA-256 (hex) of the normalised scenario and the solver version; also the ETag */
            scenarioHash: string;
            specificAngularMomentum: {
                /** @description km^2/s */
                magnitude: number;
                /** @description km^2/s */
                vector: [
                    number,
                    number,
                    number
                ];
            };
            /** @description km^2/s^2, vis-viva v^2/2 - mu/r */
            specificEnergy: number;
            /** @description km/s at epoch */
            speed: number;
            state: {
                /** @constant */
                frame: "gcrf";
                /** @description km */
                position: [
                    number,
                    number,
                    number
                ];
                /** @description km/s */
                velocity: [
                    number,
                    number,
                    number
                ];
            };
        };
        /** @description A CCSDS Orbit Mean-elements Message (one segment). Only MEAN_ELEMENT_THEORY SGP4 is propagated (absent is taken as SGP4); SGP, SGP4-XP and others answer 422 omm-unsupported. EPOCH is UTC; MEAN_MOTION in rev/day, angles in deg, BSTAR in 1/earth radii */
        OrbitMeanElementsMessage: string | {
            [key: string]: string | number;
        };
        /**
         * @description An orbit about a central body, by state vector, by elements, by a catalogue element set (tle, omm), or by an ephemeris (the osculating orbit of its first node)
         * @example {
         *       "centralBody": "earth",
         *       "elements": {
         *         "epoch": "2026-12-01T00:00:00Z",
         *         "semiMajorAxis": 6928.137,
         *         "eccentricity": 0.0012,
         *         "inclination": 97.6,
         *         "raan": 40,
         *         "argPeriapsis": 90,
         *         "trueAnomaly": 10
         *       }
         *     }
         */
        OrbitRequest: {
            /**
             * @description tle or omm only: the epoch (UTC) at which to state the age of the element set (elementSetAge); SGP4 errors grow with it (about a kilometre at the element epoch, kilometres more each day; common practice, no source)
             * @example 2026-12-01T00:00:00Z
             */
            ageAt?: string;
            centralBody?: components["schemas"]["CentralBody"];
            elements?: components["schemas"]["InitialElements"];
            ephemeris?: components["schemas"]["EphemerisOrbit"];
            /**
             * @description json (the numbers) | svg (the orbit in its plane, to scale with the body: periapsis, apoapsis, line of nodes, position at the epoch). Without it the Accept header chooses (application/json, image/svg+xml); default json
             * @enum {string}
             */
            format?: "json" | "svg";
            omm?: components["schemas"]["OrbitMeanElementsMessage"];
            state?: components["schemas"]["InitialState"];
            tle?: components["schemas"]["TwoLineElementSet"];
            /** @description UT1 - UTC, s (IERS Bulletin A); when given it wins over the EOP_FILE table, when absent the table gives it (0 without a table; 0 outside the table, with a warning in diagnostics.earthOrientation). Polar motion and dX, dY come from the table whenever it covers the epoch; used only to bring an itrf state (or itrf ephemeris nodes) to gcrf */
            ut1MinusUtc?: number;
        };
        Pass: {
            /**
             * @description Acquisition of signal: elevation rises through the limit (or the window start)
             * @example 2026-12-01T00:00:00.000000Z
             */
            aos: string;
            /** @description deg */
            azimuthAos: number;
            /** @description deg */
            azimuthLos: number;
            /** @description deg */
            azimuthTca: number;
            /** @description s */
            duration: number;
            /** @description Still up at the window stop: los is the window stop */
            endsAfterWindow: boolean;
            /** @description Sunlight on the spacecraft and the Sun's elevation at the station at AOS, TCA and LOS */
            light: {
                /** @description Light at one instant of the pass */
                aos: {
                    /** @description deg: geometric elevation of the Sun at the station */
                    sunElevation: number;
                    /** @description The spacecraft sees the centre of the solar disc (not in the Earth's umbra nor the inner half of its penumbra; conical shadow) */
                    sunlit: boolean;
                    /** @description sunlit and the Sun's elevation at the station below twilightLimit: the spacecraft can be seen optically */
                    visible: boolean;
                };
                /** @description Light at one instant of the pass */
                los: {
                    /** @description deg: geometric elevation of the Sun at the station */
                    sunElevation: number;
                    /** @description The spacecraft sees the centre of the solar disc (not in the Earth's umbra nor the inner half of its penumbra; conical shadow) */
                    sunlit: boolean;
                    /** @description sunlit and the Sun's elevation at the station below twilightLimit: the spacecraft can be seen optically */
                    visible: boolean;
                };
                /** @description Light at one instant of the pass */
                tca: {
                    /** @description deg: geometric elevation of the Sun at the station */
                    sunElevation: number;
                    /** @description The spacecraft sees the centre of the solar disc (not in the Earth's umbra nor the inner half of its penumbra; conical shadow) */
                    sunlit: boolean;
                    /** @description sunlit and the Sun's elevation at the station below twilightLimit: the spacecraft can be seen optically */
                    visible: boolean;
                };
            };
            /**
             * @description Loss of signal: elevation falls through the limit (or the window stop)
             * @example 2026-12-01T00:00:00.000000Z
             */
            los: string;
            /** @description deg: geometric, or apparent when refraction was asked */
            maxElevation: number;
            pointing?: {
                /** @description deg */
                azimuth: number;
                /** @description received / transmitted frequency, 1 - rangeRate / c (first order) */
                dopplerFactor: number;
                /** @description Hz at the carrier frequency (null without one) */
                dopplerShift: number | null;
                /** @description deg: geometric, or apparent when refraction was asked */
                elevation: number;
                /**
                 * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                epoch: string;
                /** @description km */
                range: number;
                /** @description km/s, positive receding */
                rangeRate: number;
                /** @description deg, with sunAvoidance: the angle between the boresight and the Sun */
                sunAngle?: number;
                /** @description deg: geometric elevation of the Sun at the station */
                sunElevation: number;
                /** @description With sunAvoidance: sunAngle below the limit */
                sunInBeam?: boolean;
                /** @description The spacecraft sees the centre of the solar disc (not in the Earth's umbra nor the inner half of its penumbra; conical shadow) */
                sunlit: boolean;
                /** @description sunlit and the Sun's elevation at the station below twilightLimit: the spacecraft can be seen optically */
                visible: boolean;
            }[];
            /** @description km at TCA */
            rangeTca: number;
            /** @description Already up at the window start: aos is the window start */
            startsBeforeWindow: boolean;
            station: string;
            /** @description With sunAvoidance in the request */
            sunAvoidance?: {
                /** @description Where the angle is below the limit, in time order */
                intervals: {
                    /** @description s */
                    duration: number;
                    /**
                     * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                     * @example 2026-12-01T00:00:00.000000Z
                     */
                    start: string;
                    /**
                     * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                     * @example 2026-12-01T00:00:00.000000Z
                     */
                    stop: string;
                }[];
                /** @description deg: the least boresight-Sun angle over the pass */
                minAngle: number;
                /**
                 * @description When it is least
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                minAngleAt: string;
                /** @description The angle falls below the limit somewhere in the pass */
                sunInBeam: boolean;
            };
            /**
             * @description Time of maximum elevation
             * @example 2026-12-01T00:00:00.000000Z
             */
            tca: string;
        };
        PassesAnswer: {
            /** @description s: the scan step sized from the orbit so no pass above the limit is missed */
            coarseStep: number;
            diagnostics?: components["schemas"]["SearchDiagnostics"];
            /** @enum {string} */
            model: "two-body" | "j2-secular" | "j2-analytic" | "numerical" | "ephemeris" | "sgp4";
            /** @description In time order of AOS, then station order */
            passes: components["schemas"]["Pass"][];
            propagationStopped?: components["schemas"]["PropagationStopped"];
            /** @description Present when refraction was asked: the elevations of the answer (limits, AOS/LOS, maxElevation, pointing) are apparent ones. Absent: geometric elevations */
            refraction?: {
                /** @enum {string} */
                model: "radio" | "optical";
                /** @description hPa (optical) */
                pressure?: number;
                /** @description deg C (optical) */
                temperature?: number;
            };
            scenarioHash: string;
            window: {
                /**
                 * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                start: string;
                /**
                 * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                 * @example 2026-12-01T00:00:00.000000Z
                 */
                stop: string;
            };
        };
        /** @description A spacecraft, ground stations and a window */
        PassesRequest: {
            /** @description With refraction optical only: the conditions Bennett's refraction is scaled to */
            atmosphere?: {
                /**
                 * @description Air pressure at the station, hPa (default 1010)
                 * @default 1010
                 */
                pressure?: number;
                /**
                 * @description Air temperature at the station, deg C (default 10)
                 * @default 10
                 */
                temperature?: number;
            };
            centralBody?: components["schemas"]["CentralBody"];
            elements?: components["schemas"]["InitialElements"];
            ephemeris?: components["schemas"]["EphemerisOrbit"];
            /**
             * @description Forces of the numerical model, each kind at most once (ignored by the analytic models)
             * @default []
             */
            forces?: components["schemas"]["Force"][];
            /**
             * @description json (the numbers) | svg (a timeline of the passes by station, and a sky plot per station with the horizon mask and AOS/TCA/LOS; without pointing the plot uses a pointing step of 20 s, longer when the window times the stations exceeds 8000000 s). Without it the Accept header chooses (application/json, image/svg+xml); default json
             * @enum {string}
             */
            format?: "json" | "svg";
            /**
             * @description Default: sgp4 for a tle or omm orbit, ephemeris for an ephemeris orbit, two-body otherwise. ephemeris: the given OEM interpolated (the only model of an ephemeris orbit, and only for one; see ephemeris.oem); never extrapolated. sgp4: the SGP4/SDP4 method (Vallado et al. 2006, WGS-72) from the catalogue mean elements, for tle and omm orbits only; the other models start from the SGP4 state at the element epoch (mean elements are not osculating: they are converted by SGP4 first). two-body: exact Keplerian motion (universal variables), no perturbations. j2-secular: Keplerian motion in mean elements (averaged over one revolution of the mean orbit) whose node, periapsis and mean anomaly drift at the first-order secular J2 rates, J2 about the frame z axis; bound orbits about a body with J2; short-period J2 terms left out (bounded error of 1 to 9 km at the first sample, up to ~25 km over a day, measured; see docs/accuracy.md). j2-analytic: Brouwer (1959) J2 theory with the short-period terms in Lyddane's (1963) form: mean elements (the given state inverted, so the first sample is the given state) drifting at the secular J2 rates to second order, plus the first-order short-period terms, J2 about the same axis as numerical; bound orbits with e < 0.95 about a body with J2; within 0.1 km of numerical J2 over 7 days in LEO and 1.5 km for Molniya and GTO orbits (measured; long-period terms left out, see docs/accuracy.md). numerical: two-body gravity plus `forces`, integrated (extrapolation method, relative tolerance 1e-13)
             * @enum {string}
             */
            model?: "two-body" | "j2-secular" | "j2-analytic" | "numerical" | "sgp4" | "ephemeris";
            omm?: components["schemas"]["OrbitMeanElementsMessage"];
            /** @description Ask for an antenna pointing track of each pass */
            pointing?: {
                /** @description Carrier frequency, Hz: adds the first-order Doppler shift, Hz, to each sample */
                carrierFrequency?: number;
                /** @description Pointing-track step, s (>= 0.1); at most 500000 samples over all passes */
                step: number;
            };
            /**
             * @description none (default: geometric elevations) | radio (4/3 effective Earth radius) | optical (Bennett 1982): AOS/LOS are then where the apparent elevation crosses the limit, and maxElevation and the pointing elevations are apparent
             * @enum {string}
             */
            refraction?: "none" | "radio" | "optical";
            state?: components["schemas"]["InitialState"];
            /** @description Ground stations, 1 to 100 */
            stations: components["schemas"]["GroundStation"][];
            /** @description Flag each pass (and pointing sample) where the angle between the boresight (toward the spacecraft) and the Sun falls below angle, with the intervals */
            sunAvoidance?: {
                /** @description deg: the least allowed angle between the antenna boresight and the Sun */
                angle: number;
            };
            tle?: components["schemas"]["TwoLineElementSet"];
            /**
             * @description deg (default -6, civil twilight): a pass point is visible (optically) when the spacecraft is sunlit and the Sun's elevation at the station is below this
             * @default -6
             */
            twilightLimit?: number;
            /** @description UT1 - UTC, s (IERS Bulletin A); when given it wins over the EOP_FILE table, when absent the table gives it (0 without a table; 0 outside the table, with a warning in diagnostics.earthOrientation). Polar motion and dX, dY come from the table whenever it covers the epoch; without either, 0 costs up to ~0.4 km of along-track error on the ground */
            ut1MinusUtc?: number;
            /** @description Search window (epochs in timeSystem, UTC by default), stop after start, at most 31 days */
            window: {
                /**
                 * @description Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199
                 * @example 2026-12-01T00:00:00Z
                 */
                start: string;
                /**
                 * @description Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199
                 * @example 2026-12-01T00:00:00Z
                 */
                stop: string;
                /**
                 * @description Time system of this part's epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC
                 * @enum {string}
                 */
                timeSystem?: "UTC" | "TAI" | "TT" | "GPS";
            };
        };
        /** @description One term of the potential energy U(r), chosen by kind */
        PotentialTerm: {
            /** @description k in U = k r^n, energy unit x length^-n. Exactly k r^n, no sign flip: k < 0 with n = -1 is an attractive Kepler/Coulomb term (k = -G M m), k > 0 with n = 2 a harmonic well (k = spring constant / 2) */
            coefficient: number;
            /** @description n in U = k r^n, |n| <= 20; n = 0 is a constant that shifts energies and exerts no force */
            exponent: number;
            /** @constant */
            kind: "power";
        } | {
            /** @description k in U = -k exp(-r/a) / r, energy unit x length; k > 0 attractive */
            coefficient: number;
            /** @constant */
            kind: "yukawa";
            /** @description a, the screening length, length unit (> 0) */
            range: number;
        } | {
            /**
             * @description r0, length unit (default 0)
             * @default 0
             */
            center?: number;
            /** @description V0 in U = -V0 exp(-(r - r0)^2 / (2 s^2)), energy unit; V0 > 0 a well, V0 < 0 a bump */
            depth: number;
            /** @constant */
            kind: "gaussian";
            /** @description s, the standard width, length unit (> 0) */
            width: number;
        } | {
            /** @description V0 in U = -V0 exp(-r/a), energy unit; V0 > 0 attractive */
            depth: number;
            /** @constant */
            kind: "exponential";
            /** @description a, the decay length, length unit (> 0) */
            range: number;
        } | {
            /** @description k in U = k ln(r / r0), energy unit; k > 0 attractive (force -k/r) */
            coefficient: number;
            /** @constant */
            kind: "logarithmic";
            /** @description r0, where the term is zero, length unit (> 0) */
            scale: number;
        };
        /** @description RFC 9457 problem details (application/problem+json); `type` names the code, whose meaning GET /problems/{code} gives */
        Problem: {
            /** @description What went wrong with this request, in words */
            detail: string;
            /** @description With errors: how many issues there were in all */
            errorCount?: number;
            /** @description For validation errors: the offending fields, at most 20 (paths and messages clipped to 200 characters) */
            errors?: {
                message: string;
                /** @description Where the problem is, e.g. body.state.position.0 */
                path: string;
            }[];
            /** @description The request path */
            instance: string;
            /** @description Identifies the request in the service logs */
            requestId: string;
            /**
             * @description The HTTP status code of the answer
             * @example 422
             */
            status: number;
            title: string;
            /** @description URI reference of the problem type: /problems/{code} */
            type: string;
        };
        ProblemType: {
            /** @description The error code */
            code: string;
            /** @description When the service answers this code, and what to do about it */
            meaning: string;
            /**
             * @description HTTP status answered with this code
             * @example 422
             */
            status: number;
            title: string;
            /** @description /problems/{code}, as problem documents give it */
            type: string;
        };
        /** @description Present only when the propagation stopped inside the window: what was found lies before `epoch` */
        PropagationStopped: {
            /** @description The problem code the failure has elsewhere (sgp4-failed) */
            code: string;
            /**
             * @description The first epoch (to 1 ms) where the propagation failed
             * @example 2026-12-01T00:00:00.000000Z
             */
            epoch: string;
            /** @description What the method reported, with the epoch */
            reason: string;
        };
        /** @description What the answer rests on, when it is worth saying: the ephemeris interpolation, the EOP table (absent otherwise) */
        SearchDiagnostics: {
            earthOrientation?: components["schemas"]["EarthOrientationDiagnostics"];
            /** @description Model ephemeris only: how each segment was interpolated and the largest position error estimate over the epochs the search evaluated */
            interpolation?: components["schemas"]["InterpolationDiagnostics"];
        };
        SegmentInterpolation: {
            /** @description The degree interpolated with: fewer nodes than asked in a short segment lower it, Hermite rounds it up to whole nodes */
            degree: number;
            /** @description INTERPOLATION_DEGREE of the file, or the default when it gives none */
            degreeAsked: number;
            /** @description False when the file named no INTERPOLATION_DEGREE and the default was taken */
            degreeFromFile: boolean;
            /**
             * @description lagrange: each component through the nearest nodes; hermite: positions matched with their velocities (and accelerations) at the nearest nodes
             * @enum {string}
             */
            method: "lagrange" | "hermite";
            /** @description Data lines of the segment */
            nodes: number;
            nodesPerSample: number;
            /** @description REF_FRAME as written in the file (its nodes were brought to gcrf) */
            refFrame: string;
            /** @description Start of the segment's coverage, ISO 8601 UTC */
            start: string;
            /** @description Stop of the segment's coverage, ISO 8601 UTC */
            stop: string;
            /** @description TIME_SYSTEM of the file's epochs */
            timeSystem: string;
            usesAccelerations: boolean;
        };
        StateSample: {
            /** @description ISO 8601 UTC */
            epoch: string;
            /** @description km, 6 decimals (gcrf, itrf or teme) */
            position: [
                number,
                number,
                number
            ];
            /** @description km/s, 9 decimals (gcrf, itrf or teme) */
            velocity: [
                number,
                number,
                number
            ];
        };
        /** @description The sample epochs: a regular grid (start, stop, step) or a list (times) */
        TimeGrid: {
            /**
             * @description First epoch of a regular grid (in timeSystem; UTC by default)
             * @example 2026-12-01T00:00:00Z
             */
            start?: string;
            /** @description Spacing of a regular grid, s (> 0; the direction comes from start and stop) */
            step?: number;
            /**
             * @description Last epoch of a regular grid; before start for a backwards grid. The last sample is at stop exactly (the final step may be shorter)
             * @example 2026-12-01T00:00:00Z
             */
            stop?: string;
            /** @description Instead of start/stop/step: the epochs themselves (in timeSystem), in any order */
            times?: string[];
            /**
             * @description Time system of this part's epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC
             * @enum {string}
             */
            timeSystem?: "UTC" | "TAI" | "TT" | "GPS";
        };
        TrackAnswer: {
            centralBody: {
                /** @description km^3/s^2 used */
                gm: number;
                name: string;
                radius: number | null;
            };
            diagnostics: components["schemas"]["TrackDiagnostics"];
            /** @description Forces of the numerical model (empty for the analytic models) */
            forces: components["schemas"]["Force"][];
            /** @enum {string} */
            frame: "gcrf" | "itrf" | "geodetic" | "teme";
            /** @enum {string} */
            model: "two-body" | "j2-secular" | "j2-analytic" | "numerical" | "ephemeris" | "sgp4";
            object: {
                id: string;
                name: string;
            };
            sampleCount: number;
            samples: components["schemas"]["TrackSample"][];
            scenarioHash: string;
        };
        TrackDiagnostics: {
            /** @description max |h_k - h_0| / |h_0|: the vector for two-body, the axial component h.k (over |h_0|) for j2; null when none */
            angularMomentumRelativeDrift: number | null;
            /**
             * @description What the model's dynamics conserve. two-body (models two-body, numerical without forces): the specific energy E = v^2/2 - mu/r and the angular momentum vector h = r x v. j2 (numerical with J2 only, j2-secular, j2-analytic): the J2 energy integral E = v^2/2 - mu/r + mu J2 R^2 (3 z^2/r^2 - 1) / (2 r^3) and the angular momentum about the spin axis, h.k (z = r.k, k the axis J2 acts about in that model). none (numerical with drag, a third body or radiation pressure, which change energy and angular momentum; ephemeris): nothing is checked and the drifts are null
             * @enum {string}
             */
            conservedQuantity: "two-body" | "j2" | "none";
            earthOrientation?: components["schemas"]["EarthOrientationDiagnostics"];
            /** @description max |E_k - E_0| / (mu / r_0): meaningful near parabolic where E_0 ~ 0; null when none */
            energyDriftVsPotential: number | null;
            /** @description max |E_k - E_0| / |E_0| of the conserved energy of conservedQuantity across the samples; null when none */
            energyRelativeDrift: number | null;
            /** @description Model ephemeris only: how each segment was interpolated and the largest position error estimate over the samples */
            interpolation?: components["schemas"]["InterpolationDiagnostics"];
            /** @description One sentence: what the drifts measure for this model (rounding, integration error, or the terms an analytic model leaves out), or why there are none */
            meaning: string;
        };
        /** @description An orbit and a time grid */
        TrackRequest: {
            centralBody?: components["schemas"]["CentralBody"];
            /**
             * @description CCSDS OEM only: the CREATION_DATE written in the message header (UTC; part of the scenario, so it changes the hash). Absent: the epoch of the initial state is written, so that one scenario always gives the same bytes; other formats ignore it
             * @example 2026-12-01T00:00:00Z
             */
            creationDate?: string;
            elements?: components["schemas"]["InitialElements"];
            ephemeris?: components["schemas"]["EphemerisOrbit"];
            /**
             * @description Forces of the numerical model, each kind at most once (ignored by the analytic models)
             * @default []
             */
            forces?: components["schemas"]["Force"][];
            /**
             * @description json | csv (RFC 4180, header row with units) | oem (CCSDS 502.0-B-3 KVN; gcrf, itrf or teme) | geojson (RFC 7946 ground track on WGS-84, split at the antimeridian; earth only, whatever the frame) | svg (the ground track on a world map; earth only, whatever the frame). Without it the Accept header chooses (application/json, text/csv, text/plain for OEM, application/geo+json, image/svg+xml); default json
             * @enum {string}
             */
            format?: "json" | "csv" | "oem" | "geojson" | "svg";
            /**
             * @description Output frame: gcrf (inertial, J2000 equator and equinox); itrf (Earth-fixed: IAU 2006 precession, IAU 2000B nutation, Earth rotation angle; polar motion and the pole offsets dX, dY from the EOP_FILE table when the service has one, else neglected: ~10 m at LEO); geodetic (WGS-84 latitude and longitude in deg, height in km); teme (true equator, mean equinox: the frame of SGP4; from PEF by GMST 1982, Vallado et al. 2006; for the sgp4 model the method's own states, for the others rotated from gcrf through PEF). itrf, geodetic and teme need centralBody earth
             * @default gcrf
             * @enum {string}
             */
            frame?: "gcrf" | "itrf" | "geodetic" | "teme";
            grid: components["schemas"]["TimeGrid"];
            /**
             * @description Default: sgp4 for a tle or omm orbit, ephemeris for an ephemeris orbit, two-body otherwise. ephemeris: the given OEM interpolated (the only model of an ephemeris orbit, and only for one; see ephemeris.oem); never extrapolated. sgp4: the SGP4/SDP4 method (Vallado et al. 2006, WGS-72) from the catalogue mean elements, for tle and omm orbits only; the other models start from the SGP4 state at the element epoch (mean elements are not osculating: they are converted by SGP4 first). two-body: exact Keplerian motion (universal variables), no perturbations. j2-secular: Keplerian motion in mean elements (averaged over one revolution of the mean orbit) whose node, periapsis and mean anomaly drift at the first-order secular J2 rates, J2 about the frame z axis; bound orbits about a body with J2; short-period J2 terms left out (bounded error of 1 to 9 km at the first sample, up to ~25 km over a day, measured; see docs/accuracy.md). j2-analytic: Brouwer (1959) J2 theory with the short-period terms in Lyddane's (1963) form: mean elements (the given state inverted, so the first sample is the given state) drifting at the secular J2 rates to second order, plus the first-order short-period terms, J2 about the same axis as numerical; bound orbits with e < 0.95 about a body with J2; within 0.1 km of numerical J2 over 7 days in LEO and 1.5 km for Molniya and GTO orbits (measured; long-period terms left out, see docs/accuracy.md). numerical: two-body gravity plus `forces`, integrated (extrapolation method, relative tolerance 1e-13)
             * @enum {string}
             */
            model?: "two-body" | "j2-secular" | "j2-analytic" | "numerical" | "sgp4" | "ephemeris";
            /**
             * @description Labels for the exported track
             * @default {
             *       "name": "UNNAMED",
             *       "id": "UNKNOWN"
             *     }
             */
            object?: {
                /**
                 * @description Object identifier (OEM OBJECT_ID), printable ASCII
                 * @default UNKNOWN
                 */
                id?: string;
                /**
                 * @description Object name (OEM OBJECT_NAME), printable ASCII
                 * @default UNNAMED
                 */
                name?: string;
            };
            omm?: components["schemas"]["OrbitMeanElementsMessage"];
            /**
             * @description Propagate as a point mass even below the body radius; by default a track that meets the body is refused (422 impact)
             * @default false
             */
            passThroughBody?: boolean;
            state?: components["schemas"]["InitialState"];
            tle?: components["schemas"]["TwoLineElementSet"];
            /** @description UT1 - UTC, s (IERS Bulletin A); when given it wins over the EOP_FILE table, when absent the table gives it (0 without a table; 0 outside the table, with a warning in diagnostics.earthOrientation). Polar motion and dX, dY come from the table whenever it covers the epoch; without either, 0 costs up to ~0.4 km along-track in Earth-fixed frames */
            ut1MinusUtc?: number;
        };
        TrackSample: components["schemas"]["StateSample"] | components["schemas"]["GeodeticSample"];
        TwoBodyAnswer: {
            /** @description Barycentre (centre of mass) at the epoch, km and km/s in the request frame. With no external force it moves uniformly: r_cm(t) = r_cm0 + v_cm (t - epoch) */
            barycenter: {
                /** @description km */
                position: [
                    number,
                    number,
                    number
                ];
                /** @description km/s */
                velocity: [
                    number,
                    number,
                    number
                ];
            };
            bodies: [
                {
                    /** @description km^3/s^2: as given, or G m */
                    gm: number;
                    /** @description kg: as given, or GM / G */
                    mass: number;
                    /** @description m_i / (m1 + m2), dimensionless */
                    massFraction: number;
                    /** @description The label given in the request (null without one) */
                    name: string | null;
                    /** @description s, the same as the relative orbit's (null when unbound) */
                    period: number | null;
                    /** @description km from the barycentre at the epoch: r1 = -(m2/M) r, r2 = (m1/M) r */
                    position: [
                        number,
                        number,
                        number
                    ];
                    /** @description km of this body's ellipse about the barycentre, a1 = a m2/M, a2 = a m1/M (null when unbound) */
                    semiMajorAxis: number | null;
                    /** @description km/s relative to the barycentre: v1 = -(m2/M) v, v2 = (m1/M) v */
                    velocity: [
                        number,
                        number,
                        number
                    ];
                },
                {
                    /** @description km^3/s^2: as given, or G m */
                    gm: number;
                    /** @description kg: as given, or GM / G */
                    mass: number;
                    /** @description m_i / (m1 + m2), dimensionless */
                    massFraction: number;
                    /** @description The label given in the request (null without one) */
                    name: string | null;
                    /** @description s, the same as the relative orbit's (null when unbound) */
                    period: number | null;
                    /** @description km from the barycentre at the epoch: r1 = -(m2/M) r, r2 = (m1/M) r */
                    position: [
                        number,
                        number,
                        number
                    ];
                    /** @description km of this body's ellipse about the barycentre, a1 = a m2/M, a2 = a m1/M (null when unbound) */
                    semiMajorAxis: number | null;
                    /** @description km/s relative to the barycentre: v1 = -(m2/M) v, v2 = (m1/M) v */
                    velocity: [
                        number,
                        number,
                        number
                    ];
                }
            ];
            /** @description The integrals of the pair computed two independent ways; their relative difference shows the rounding (it grows for extreme mass ratios, where the barycentre velocity cancels) */
            conserved: {
                /** @description Total angular momentum about the barycentre, kg km^2/s (1 kg km^2/s = 1e6 kg m^2/s) */
                angularMomentum: {
                    /** @description kg km^2/s (= 1e6 kg m^2/s): sum of m_i r_i x v_i about the barycentre */
                    fromBodies: [
                        number,
                        number,
                        number
                    ];
                    /** @description kg km^2/s: reduced mass times r x v of the relative motion */
                    fromRelativeMotion: [
                        number,
                        number,
                        number
                    ];
                    /** @description |fromBodies - fromRelativeMotion| / max of their magnitudes (vector difference) */
                    relativeDifference: number;
                    /** @constant */
                    unit: "kg km^2/s";
                };
                /** @description Total energy in the barycentre frame, kg km^2/s^2 (1 kg km^2/s^2 = 1e6 J = 1 MJ) */
                energy: {
                    /** @description kg km^2/s^2 (= MJ): sum of m_i |v_i|^2 / 2 about the barycentre minus G m1 m2 / |r| */
                    fromBodies: number;
                    /** @description kg km^2/s^2 (= MJ): reduced mass times the relative orbit's specific energy */
                    fromRelativeMotion: number;
                    /** @description |fromBodies - fromRelativeMotion| / max(|fromBodies|, |fromRelativeMotion|); 0 when both are 0 */
                    relativeDifference: number;
                    /** @constant */
                    unit: "kg km^2/s^2";
                };
            };
            /**
             * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
             * @example 2026-12-01T00:00:00.000000Z
             */
            epoch: string;
            /** @constant */
            frame: "gcrf";
            /** @description The Newtonian constant of gravitation used to convert between mass (kg) and GM (km^3/s^2) */
            gravitationalConstant: {
                /** @description Relative standard uncertainty of G: every mass derived from a GM (kg = GM / G) carries it */
                relativeUncertainty: number;
                source: string;
                /** @constant */
                unit: "km^3 kg^-1 s^-2";
                /** @description G, km^3 kg^-1 s^-2 (= 1e-9 times the SI value in m^3 kg^-1 s^-2) */
                value: number;
            };
            /** @description m1 m2 / (m1 + m2), kg */
            reducedMass: number;
            /** @description The relative orbit as POST /v1/orbit answers it, with mu = G (m1 + m2) and the same scenarioHash; its centralBody is named "<name1>+<name2>" and has no radius (point masses), so altitudes and intersectsBody are null */
            relativeOrbit: components["schemas"]["OrbitAnswer"];
            /** @description Body 2 seen from body 1 at the epoch: r = r2 - r1 (km), v = v2 - v1 (km/s) */
            relativeState: {
                /** @description km */
                position: [
                    number,
                    number,
                    number
                ];
                /** @description km/s */
                velocity: [
                    number,
                    number,
                    number
                ];
            };
            /** @description SHA-256 (hex) of the normalised scenario and the solver version; also the ETag */
            scenarioHash: string;
            /** @description mu = G (m1 + m2), km^3/s^2: the gravitational parameter of the relative orbit */
            totalGm: number;
            /** @description M = m1 + m2, kg (each mass as given, or GM / G), printed to 15 significant digits */
            totalMass: number;
            /** @description null unless the request asked for a track */
            tracks: {
                bodies: [
                    {
                        /** @description The label given in the request (null without one) */
                        name: string | null;
                        samples: {
                            /**
                             * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                             * @example 2026-12-01T00:00:00.000000Z
                             */
                            epoch: string;
                            /** @description km from the barycentre, 6 decimals */
                            position: [
                                number,
                                number,
                                number
                            ];
                            /** @description km/s relative to the barycentre, 9 decimals */
                            velocity: [
                                number,
                                number,
                                number
                            ];
                        }[];
                    },
                    {
                        /** @description The label given in the request (null without one) */
                        name: string | null;
                        samples: {
                            /**
                             * @description ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it
                             * @example 2026-12-01T00:00:00.000000Z
                             */
                            epoch: string;
                            /** @description km from the barycentre, 6 decimals */
                            position: [
                                number,
                                number,
                                number
                            ];
                            /** @description km/s relative to the barycentre, 9 decimals */
                            velocity: [
                                number,
                                number,
                                number
                            ];
                        }[];
                    }
                ];
                diagnostics: components["schemas"]["TrackDiagnostics"];
                /**
                 * @description Axes of the request frame; the origin moves with the barycentre (add r_cm0 + v_cm (t - epoch) for inertial positions)
                 * @constant
                 */
                frame: "gcrf";
                /** @constant */
                origin: "barycenter";
                sampleCount: number;
            } | null;
        };
        /** @description One body: a point mass with its state in the request frame */
        TwoBodyMember: {
            /** @description Gravitational parameter GM = G m, km^3/s^2, 1e-49 to 1e+30 (give mass or gm, not both); the mass is then reported as GM / G */
            gm?: number;
            /** @description Mass, kg, 1e-30 to 1e+50 (give mass or gm, not both); used as GM = G m */
            mass?: number;
            /** @description A label for the body, echoed in the answer */
            name?: string;
            /** @description Position [x, y, z], km, each within +-1e18 */
            position: [
                number,
                number,
                number
            ];
            /** @description Velocity [vx, vy, vz], km/s, each within +-299792.458 (the speed of light) */
            velocity: [
                number,
                number,
                number
            ];
        };
        /** @description Two point masses (mass in kg or GM in km^3/s^2, position km, velocity km/s) in one inertial frame at one epoch */
        TwoBodyRequest: {
            /** @description Exactly two bodies; the relative state is body 2 seen from body 1 */
            bodies: [
                components["schemas"]["TwoBodyMember"],
                components["schemas"]["TwoBodyMember"]
            ];
            /**
             * @description Epoch of both states, in timeSystem (UTC by default: ISO 8601 ending in Z), years 1972-2199
             * @example 2026-12-01T00:00:00Z
             */
            epoch: string;
            /**
             * @description Inertial frame of both states: gcrf (J2000 equator and equinox)
             * @default gcrf
             * @enum {string}
             */
            frame?: "gcrf";
            /**
             * @description Time system of this part's epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC
             * @enum {string}
             */
            timeSystem?: "UTC" | "TAI" | "TT" | "GPS";
            /** @description Ask for both bodies' tracks about the barycentre on this time grid (same grid options and MAX_TRACK_SAMPLES limit as /v1/track) */
            track?: {
                grid: components["schemas"]["TimeGrid"];
            };
        };
        /** @description A two-line element set (SGP4 mean elements, TEME, epoch UTC). Checksums are verified; Alpha-5 catalogue numbers are accepted; two-digit years 57-99 are 1957-1999, 00-56 are 2000-2056. A malformed field answers 422 tle-malformed naming the line, the columns and what was expected */
        TwoLineElementSet: {
            /** @description Line 1 of the two-line set: exactly 69 characters, columns as in Spacetrack Report No. 3 (epoch, mean motion derivatives, BSTAR), checksum in column 69 */
            line1: string;
            /** @description Line 2: exactly 69 characters (inclination, RAAN, eccentricity, argument of perigee, mean anomaly in deg; mean motion in rev/day), checksum in column 69 */
            line2: string;
            /** @description Object name (line 0 of a three-line set) */
            name?: string;
        };
    };
    responses: never;
    parameters: never;
    requestBodies: never;
    headers: never;
    pathItems: never;
}
export type $defs = Record<string, never>;
export interface operations {
    getHealth: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        solverVersion: string;
                        /** @enum {string} */
                        status: "ok" | "closing";
                    };
                };
            };
        };
    };
    getMetrics: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Prometheus text format 0.0.4 */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "text/plain": string;
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getProblemType: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description An error code, e.g. validation-failed */
                code: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ProblemType"];
                };
            };
            /** @description problem-type-unknown: no such code */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getReadiness: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        /** @description Each dependency and "ok", or why it is not ready */
                        checks: {
                            [key: string]: string;
                        };
                        /** @description With EOP_FILE set: the IERS table in force */
                        earthOrientation?: {
                            days: number;
                            /** @description SHA-256 of the rows: part of every scenario hash about the Earth */
                            digest: string;
                            file: string;
                            /** @description First day of the table (UTC date) */
                            firstDate: string;
                            /** @description Last day whose polar motion and UT1-UTC are observed (IERS flag I) */
                            lastObservedDate: string | null;
                            /** @description Last day of the table (predictions) */
                            lastPredictedDate: string;
                            /** @description Why the last reload failed (the table above stays in force), or null */
                            lastReloadError: string | null;
                            loadedAt: string;
                        };
                        /** @description The dependencies that are not ready (empty when status is ok) */
                        missing: string[];
                        solverVersion: string;
                        /** @enum {string} */
                        status: "ok" | "closing" | "not-ready";
                    };
                };
            };
            /** @description Default Response */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        /** @description Each dependency and "ok", or why it is not ready */
                        checks: {
                            [key: string]: string;
                        };
                        /** @description With EOP_FILE set: the IERS table in force */
                        earthOrientation?: {
                            days: number;
                            /** @description SHA-256 of the rows: part of every scenario hash about the Earth */
                            digest: string;
                            file: string;
                            /** @description First day of the table (UTC date) */
                            firstDate: string;
                            /** @description Last day whose polar motion and UT1-UTC are observed (IERS flag I) */
                            lastObservedDate: string | null;
                            /** @description Last day of the table (predictions) */
                            lastPredictedDate: string;
                            /** @description Why the last reload failed (the table above stays in force), or null */
                            lastReloadError: string | null;
                            loadedAt: string;
                        };
                        /** @description The dependencies that are not ready (empty when status is ok) */
                        missing: string[];
                        solverVersion: string;
                        /** @enum {string} */
                        status: "ok" | "closing" | "not-ready";
                    };
                };
            };
        };
    };
    runBatch: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["BatchRequest"];
            };
        };
        responses: {
            /** @description One JSON object per line, one line per item, in input order */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/x-ndjson": components["schemas"]["BatchLine"];
                };
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    listBodies: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["BodiesAnswer"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    solveCentralForce: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["CentralForceRequest"];
            };
        };
        responses: {
            /** @description The analysis (JSON) or its plot (SVG) */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["CentralForceAnswer"];
                    "image/svg+xml": string;
                };
            };
            /** @description Not modified: If-None-Match holds this answer's ETag (its scenario hash); no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored */
            504: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    findEclipses: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["EclipsesRequest"];
            };
        };
        responses: {
            /** @description The eclipses (JSON, CSV or SVG) */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["EclipsesAnswer"];
                    "image/svg+xml": string;
                    "text/csv": string;
                };
            };
            /** @description Not modified: If-None-Match holds this answer's ETag (its scenario hash); no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored */
            504: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    listJobs: {
        parameters: {
            query?: {
                /** @description The `next` of the previous page */
                cursor?: string;
                /** @description Jobs per page (1 to 100, default 20) */
                limit?: number;
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["JobList"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    submitJob: {
        parameters: {
            query?: never;
            header?: {
                /** @description Your key for this submission: a repeat with the same body answers the same job */
                "idempotency-key"?: string;
            };
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["JobRequest"];
            };
        };
        responses: {
            /** @description Queued */
            202: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["JobAccepted"];
                };
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description idempotency-conflict */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description limit-exceeded (more than BATCH_MAX_ITEMS items, or, in process, items larger than JOBS_MAX_BYTES), job-not-comparable, callback-not-allowed */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getJob: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The job id (a UUID) */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["JobAnswer"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-found */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    cancelJob: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The job id (a UUID) */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["JobAnswer"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-found */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-finished */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getJobArchive: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The job id (a UUID) */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The archive */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/gzip": string;
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-found */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-done */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description limit-exceeded */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getJobChanges: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The job id (a UUID) */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One JSON object per item, in input order */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/x-ndjson": {
                        change: string;
                        id: string | null;
                        index: number;
                        kind: string;
                    };
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-found */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-done */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-comparable */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getJobResults: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The job id (a UUID) */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One JSON object per line, one line per item, in input order */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/x-ndjson": components["schemas"]["BatchLine"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-found */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-done */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getJobItem: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The job id (a UUID) */
                id: string;
                index: number;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The item's product, or its line (one JSON object) */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/geo+json": unknown;
                    "application/json": components["schemas"]["BatchLine"];
                    "image/svg+xml": string;
                    "text/csv": string;
                    "text/plain": string;
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description job-not-found, item-not-written */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits neither the product's media type nor application/json */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description queue-unavailable: the queue's store does not answer, or the in-process queue is full; see Retry-After */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    solveOrbit: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["OrbitRequest"];
            };
        };
        responses: {
            /** @description The orbit (JSON) or its plot (SVG) */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["OrbitAnswer"];
                    "image/svg+xml": string;
                };
            };
            /** @description Not modified: If-None-Match holds this answer's ETag (its scenario hash); no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored */
            504: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    findPasses: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["PassesRequest"];
            };
        };
        responses: {
            /** @description The passes (JSON) or their plots (SVG) */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["PassesAnswer"];
                    "image/svg+xml": string;
                };
            };
            /** @description Not modified: If-None-Match holds this answer's ETag (its scenario hash); no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored */
            504: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getResult: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description SHA-256 (hex) of the normalised scenario and the solver version; also the ETag */
                scenarioHash: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The stored answer, byte for byte, in the media type it was first sent with: JSON, CSV, CCSDS OEM (text/plain), GeoJSON, SVG or NDJSON */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/geo+json": {
                        [key: string]: unknown;
                    };
                    "application/json": {
                        [key: string]: unknown;
                    };
                    "image/svg+xml": string;
                    "text/csv": string;
                    "text/plain": string;
                };
            };
            /** @description Not modified: If-None-Match holds this hash; no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description result-not-cached: nothing stored under this hash for you */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    propagateTrack: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TrackRequest"];
            };
        };
        responses: {
            /** @description The track */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/geo+json": string;
                    "application/json": components["schemas"]["TrackAnswer"];
                    "image/svg+xml": string;
                    "text/csv": string;
                    "text/plain": string;
                };
            };
            /** @description Not modified: If-None-Match holds this answer's ETag (its scenario hash); no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored */
            504: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    reduceTwoBody: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TwoBodyRequest"];
            };
        };
        responses: {
            /** @description Default Response */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["TwoBodyAnswer"];
                };
            };
            /** @description Not modified: If-None-Match holds this answer's ETag (its scenario hash); no body */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate) */
            401: {
                headers: {
                    /** @description Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750) */
                    "www-authenticate"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description not-acceptable: Accept admits none of the formats this operation produces */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description request-timeout: the body did not arrive within BODY_TIMEOUT_S */
            408: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description body-too-large: the body exceeds BODY_LIMIT_BYTES */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description unsupported-media-type: bodies are application/json */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description rate-limited: this key (or address) spent its budget for the minute */
            429: {
                headers: {
                    /** @description Requests allowed per window */
                    "ratelimit-limit"?: number;
                    /** @description Requests left in this window */
                    "ratelimit-remaining"?: number;
                    /** @description Seconds until the window resets */
                    "ratelimit-reset"?: number;
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After */
            503: {
                headers: {
                    /** @description Seconds to wait before retrying */
                    "retry-after"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored */
            504: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
}
