#!/usr/bin/python3
# Writes test/fixtures/erfa-gcrs-itrs.json: GCRS -> ITRS matrices of the IAU 2006/2000A transformation
# (CIO based: X, Y from the IAU 2006/2000A series, s, ERA, polar motion with s') computed with ERFA
# (pyerfa, Debian package python3-erfa 2.0.0.1, ERFA 2.0.0, a re-licensed copy of IAU SOFA), run
# once by hand: `/usr/bin/python3 scripts/erfa-reference.py`. Cases without Earth orientation data
# (UT1 = UTC, no polar motion, no pole offsets) and with the finals2000A excerpt in test/fixtures
# applied; this script reads and interpolates that file itself (linearly between daily rows).
import json
import erfa

FINALS = 'test/fixtures/finals2000A-2025-2027.txt'


def finals_rows(path):
    rows = {}
    for line in open(path):
        try:
            mjd = int(float(line[7:15]))
            xp, yp, dut1 = float(line[18:27]), float(line[37:46]), float(line[58:68])
        except ValueError:
            continue
        try:
            dx, dy = float(line[97:106]), float(line[116:125])
        except ValueError:
            dx, dy = 0.0, 0.0
        rows[mjd] = (xp, yp, dut1, dx, dy)
    return rows


def interpolate(rows, mjd):
    i = int(mjd // 1)
    f = mjd - i
    a, b = rows[i], rows[i + 1]
    return tuple(a[k] + f * (b[k] - a[k]) for k in range(5))


def matrix(iso, dut1, xp_as, yp_as, dx_mas, dy_mas):
    date, clock = iso.rstrip('Z').split('T')
    y, mo, d = map(int, date.split('-'))
    h, mi, sec = clock.split(':')
    u1, u2 = erfa.dtf2d('UTC', y, mo, d, int(h), int(mi), float(sec))
    tai1, tai2 = erfa.utctai(u1, u2)
    tt1, tt2 = erfa.taitt(tai1, tai2)
    ut11, ut12 = erfa.utcut1(u1, u2, dut1)
    mas = erfa.DAS2R / 1000
    x, yy = erfa.xy06(tt1, tt2)
    x, yy = x + dx_mas * mas, yy + dy_mas * mas
    s = erfa.s06(tt1, tt2, x, yy)
    rc2i = erfa.c2ixys(x, yy, s)
    era = erfa.era00(ut11, ut12)
    rpom = erfa.pom00(xp_as * erfa.DAS2R, yp_as * erfa.DAS2R, erfa.sp00(tt1, tt2))
    rc2t = erfa.c2tcio(rc2i, era, rpom)
    mjd_utc = u1 - 2400000.5 + u2
    dpsi, deps = erfa.nut00b(tt1, tt2)
    parts = {'nut00bDpsiRad': float(dpsi), 'nut00bDepsRad': float(deps), 'obl06Rad': float(erfa.obl06(tt1, tt2)),
             'era00Rad': float(era), 'gmst06Rad': float(erfa.gmst06(ut11, ut12, tt1, tt2))}
    return mjd_utc, [float(v) for v in rc2t.flatten()], parts


NO_EOP = ['1996-07-01T00:00:00Z', '2004-04-06T07:51:28.386009Z', '2010-01-01T00:00:00Z', '2020-06-15T18:30:00Z',
          '2026-03-01T00:00:00Z', '2026-12-02T06:00:00Z', '2035-09-09T09:09:09Z', '2049-12-31T12:00:00Z']
WITH_EOP = ['2025-01-01T00:00:00Z', '2025-06-30T13:17:41.5Z', '2026-03-01T00:00:00Z', '2026-08-26T06:00:00Z',
            '2026-12-02T06:00:00Z', '2027-05-20T21:00:00Z']

rows = finals_rows(FINALS)
cases = []
for iso in NO_EOP:
    _, m, parts = matrix(iso, 0.0, 0.0, 0.0, 0.0, 0.0)
    cases.append({'utc': iso, 'eop': False, 'ut1MinusUtc': 0, 'xpArcsec': 0, 'ypArcsec': 0, 'dXMas': 0, 'dYMas': 0, 'gcrsToItrs': m, **parts})
for iso in WITH_EOP:
    mjd, _, _ = matrix(iso, 0.0, 0.0, 0.0, 0.0, 0.0)
    xp, yp, dut1, dx, dy = interpolate(rows, mjd)
    _, m, parts = matrix(iso, dut1, xp, yp, dx, dy)
    cases.append({'utc': iso, 'eop': True, 'ut1MinusUtc': dut1, 'xpArcsec': xp, 'ypArcsec': yp, 'dXMas': dx, 'dYMas': dy, 'gcrsToItrs': m, **parts})

out = {
    'source': 'ERFA 2.0.0 via pyerfa 2.0.0.1 (Debian python3-erfa): xy06 + (dX, dY), s06, c2ixys, era00, sp00, pom00, c2tcio; per case also nut00b, obl06, era00, gmst06; '
              'IAU 2006/2000A, CIO based (IERS Conventions 2010 ch. 5). Written by scripts/erfa-reference.py; '
              'EOP cases use test/fixtures/finals2000A-2025-2027.txt (Bulletin A columns) interpolated linearly by that script.',
    'cases': cases,
}
with open('test/fixtures/erfa-gcrs-itrs.json', 'w') as f:
    json.dump(out, f, indent=1)
    f.write('\n')
print(f'wrote {len(cases)} cases')
