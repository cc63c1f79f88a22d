#!/usr/bin/python3
"""Reference tables for Comove's cosmology engine, computed with Debian's python3-astropy.

Run with the system Python (Debian 12: astropy 5.2.1, scipy 1.10.1, numpy 1.24.2):

    apt-get install python3-astropy
    npm run reference:update        # = /usr/bin/python3 test/reference/make_astropy_tables.py > test/reference/astropy-tables.json

Conventions. Comove's Omega_m includes massive neutrinos (Omega_nu h^2 = sum m_nu / 93.14 eV,
the Planck convention); astropy's Om0 excludes them. So astropy is given
Om0 = Omega_m - sum m_nu / (93.14 eV h^2). Both put sum m_nu into one massive eigenstate with
N_eff shared equally among floor(N_eff) species, and both use the Komatsu et al. 2011 eq. 26
fitting function, so the neutrino treatment is the same and agreement should be at the level
of the integrators (about 1e-8).

The parameter sets are an explicit grid (no random numbers), so the output is reproducible.
"""

import itertools
import json
import math
import sys

import astropy
import astropy.units as u
import numpy
import scipy
from astropy.cosmology import Flatw0waCDM, w0waCDM

NU_MASS_PER_OMEGA_H2 = 93.14
REDSHIFTS = [0.001, 0.01, 0.1, 0.5, 1.0, 2.0, 3.0, 5.0, 10.0, 30.0, 100.0, 1100.0]
Z1_PAIR = 0.5


def parameter_sets():
    """62 sets spanning flat/open/closed, w0-wa, no radiation, radiation with N_eff and massive neutrinos."""
    sets = []
    # Geometry: (Omega_m, Omega_Lambda or None for flat)
    geometries = [(0.3, None), (0.25, None), (0.3, 0.6), (0.3, 0.8), (0.5, 0.3), (0.1, 0.0)]
    dark_energy = [(-1.0, 0.0), (-0.9, 0.2), (-1.1, -0.3)]
    radiation = [
        (0.0, 0.0, 0.0),  # T_CMB, N_eff, m_nu: no radiation
        (2.7255, 3.046, 0.0),
        (2.7255, 3.046, 0.06),
    ]
    hubble = [70.0, 67.66]
    for i, ((om, ol), (w0, wa), (t, neff, mnu)) in enumerate(itertools.product(geometries, dark_energy, radiation)):
        sets.append(dict(H0=hubble[i % 2], Omega_m=om, Omega_Lambda=ol, w0=w0, wa=wa, T_CMB=t, N_eff=neff, m_nu=mnu))
    # A few more unusual ones: several neutrino masses and N_eff values, strong curvature.
    extra = [
        dict(H0=70.0, Omega_m=0.3, Omega_Lambda=None, w0=-1.0, wa=0.0, T_CMB=2.7255, N_eff=3.046, m_nu=0.3),
        dict(H0=72.0, Omega_m=0.28, Omega_Lambda=None, w0=-1.0, wa=0.0, T_CMB=2.7255, N_eff=4.0, m_nu=0.12),
        dict(H0=65.0, Omega_m=0.32, Omega_Lambda=0.7, w0=-1.0, wa=0.0, T_CMB=2.7255, N_eff=2.5, m_nu=0.1),
        dict(H0=70.0, Omega_m=1.0, Omega_Lambda=0.0, w0=-1.0, wa=0.0, T_CMB=0.0, N_eff=0.0, m_nu=0.0),
        dict(H0=50.0, Omega_m=0.2, Omega_Lambda=0.3, w0=-1.0, wa=0.0, T_CMB=2.7255, N_eff=3.046, m_nu=0.0),
        dict(H0=80.0, Omega_m=0.35, Omega_Lambda=0.75, w0=-1.0, wa=0.0, T_CMB=2.7255, N_eff=3.046, m_nu=0.06),
        dict(H0=70.0, Omega_m=0.6, Omega_Lambda=0.7, w0=-1.0, wa=0.0, T_CMB=2.7255, N_eff=3.046, m_nu=0.0),
        dict(H0=70.0, Omega_m=0.4, Omega_Lambda=0.9, w0=-0.8, wa=0.0, T_CMB=0.0, N_eff=0.0, m_nu=0.0),
    ]
    sets.extend(extra)
    return sets


def astropy_model(p):
    h = p["H0"] / 100.0
    om_cb = p["Omega_m"] - p["m_nu"] / NU_MASS_PER_OMEGA_H2 / h**2
    kwargs = dict(H0=p["H0"], Om0=om_cb, w0=p["w0"], wa=p["wa"], Tcmb0=p["T_CMB"])
    if p["T_CMB"] > 0:
        species = max(1, int(math.floor(p["N_eff"])))
        kwargs["Neff"] = p["N_eff"]
        kwargs["m_nu"] = [0.0] * (species - 1) + [p["m_nu"]] if p["m_nu"] > 0 else 0.0
        kwargs["m_nu"] = kwargs["m_nu"] * u.eV if isinstance(kwargs["m_nu"], float) else numpy.array(kwargs["m_nu"]) * u.eV
    if p["Omega_Lambda"] is None:
        return Flatw0waCDM(**kwargs)
    return w0waCDM(Ode0=p["Omega_Lambda"], **kwargs)


def row(cosmo, z):
    dh = (astropy.constants.c / cosmo.H0).to(u.Mpc).value
    ok = cosmo.Ok0
    dc = cosmo.comoving_distance(z).to(u.Mpc).value
    volume_valid = ok >= 0 or math.sqrt(-ok) * dc / dh < math.pi / 2
    r = {
        "z": z,
        "comovingDistance": dc,
        "transverseComovingDistance": cosmo.comoving_transverse_distance(z).to(u.Mpc).value,
        "angularDiameterDistance": cosmo.angular_diameter_distance(z).to(u.Mpc).value,
        "luminosityDistance": cosmo.luminosity_distance(z).to(u.Mpc).value,
        "distanceModulus": cosmo.distmod(z).value,
        "lookbackTime": cosmo.lookback_time(z).to(u.Gyr).value,
        "lightTravelDistance": cosmo.lookback_distance(z).to(u.Mpc).value,
        "age": cosmo.age(z).to(u.Gyr).value,
        "hubbleParameter": cosmo.H(z).to(u.km / u.s / u.Mpc).value,
        "expansionRate": float(cosmo.efunc(z)),
        "properKpcPerArcmin": cosmo.kpc_proper_per_arcmin(z).value,
        "comovingKpcPerArcmin": cosmo.kpc_comoving_per_arcmin(z).value,
        "comovingVolume": cosmo.comoving_volume(z).to(u.Gpc**3).value if volume_valid else None,
        "differentialComovingVolume": cosmo.differential_comoving_volume(z).to(u.Mpc**3 / u.sr).value,
        "criticalDensity": cosmo.critical_density(z).to(u.g / u.cm**3).value,
        "omegaDarkEnergy": float(cosmo.Ode(z)),
        "omegaCurvature": float(cosmo.Ok(z)),
        "omegaPhotons": float(cosmo.Ogamma(z)),
        "omegaNeutrinos": float(cosmo.Onu(z)),
        "cmbTemperature": cosmo.Tcmb(z).value,
    }
    if z > Z1_PAIR:
        r["angularDiameterDistanceFromZ1"] = cosmo.angular_diameter_distance_z1z2(Z1_PAIR, z).to(u.Mpc).value
    return r


def main():
    out = {
        "generator": "test/reference/make_astropy_tables.py",
        "library": {"astropy": astropy.__version__, "scipy": scipy.__version__, "numpy": numpy.__version__, "python": sys.version.split()[0]},
        "conventions": "Omega_m includes massive neutrinos (Omega_nu h^2 = m_nu / 93.14 eV); astropy Om0 = Omega_m - Omega_nu",
        "z1ForPairs": Z1_PAIR,
        "sets": [],
    }
    for p in parameter_sets():
        cosmo = astropy_model(p)
        out["sets"].append({
            "input": {k: v for k, v in p.items() if v is not None},
            "flat": p["Omega_Lambda"] is None,
            "derived": {
                "Omega_k": cosmo.Ok0,
                "Omega_gamma": cosmo.Ogamma0,
                "Omega_nu": cosmo.Onu0,
                "Omega_de": cosmo.Ode0,
                "ageToday": cosmo.age(0).to(u.Gyr).value,
                "hubbleTime": cosmo.hubble_time.to(u.Gyr).value,
                "hubbleDistance": cosmo.hubble_distance.to(u.Mpc).value,
            },
            "rows": [row(cosmo, z) for z in REDSHIFTS],
        })
    json.dump(out, sys.stdout, indent=1)
    sys.stdout.write("\n")


if __name__ == "__main__":
    main()
