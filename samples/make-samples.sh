#!/usr/bin/env bash
# Regenerates the demo site's captures with `wavecheck synth` (deterministic: same bytes every time).
# The circuits and what each should show are described in samples/README.md.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(dirname "$here")"
dotnet build "$root/src/WaveCheck.Cli" -c Release -v quiet -nologo >/dev/null
wavecheck() { dotnet "$root/src/WaveCheck.Cli/bin/Release/net10.0/wavecheck.dll" "$@"; }

# C1: three-phase drive on the panel saw: 8 kHz switching leakage through the motor cable, 150 Hz common-mode
# current of the rectifier, mains leakage of the EMC filter.
wavecheck synth switching:rms=40mA,freq=8kHz,motor=45Hz sine:rms=6mA,freq=150Hz sine:rms=3mA noise:rms=0.2mA,seed=1 \
  --duration 2s --rate 50kHz --format pcm16 -o "$here/c1-panel-saw-drive.wav"

# C2: single-phase drive on the dust extractor: 12 Hz motor frequency, mains and a 1 kHz switching component.
wavecheck synth composite:rms=12mA,motor=12Hz,switch=1kHz noise:rms=0.1mA,seed=2 \
  --duration 2s --rate 50kHz --format pcm16 -o "$here/c2-extractor-fan.wav"

# C2 again, at start-up: the drive runs the fan up from standstill (5 Hz motor frequency) while its DC link settles,
# with more leakage and 2 mA smooth DC: this state, not the running one, decides what C2 needs.
wavecheck synth composite:rms=15mA,motor=5Hz,switch=1kHz dc:level=2mA noise:rms=0.1mA,seed=7 \
  --duration 2s --rate 50kHz --format pcm16 -o "$here/c2-extractor-fan-start.wav"

# C3: charging point, bay 1: 2.5 mA smooth DC of the on-board charger, the charger's filter capacitance (40 nF) and
# damp in the yard cable's buried junction box (150 kΩ to earth); the logger's second channel recorded L to PE
# (500 V full scale), so the leakage splits into its resistive and capacitive parts.
wavecheck synth leak:r=150k,c=40nF dc:level=2.5mA noise:rms=0.05mA,seed=3 \
  --supply 230V,h3=1.5%,h5=3%,h7=1.5% --voltage-full-scale 500V \
  --duration 2s --rate 50kHz --format pcm16 -o "$here/c3-ev-bay1.wav"

# C4: charging point, bay 2: 9 mA smooth DC with six-pulse ripple (a faulty three-phase on-board charger).
wavecheck synth sixpulse:mean=9mA sine:rms=2mA noise:rms=0.05mA,seed=4 \
  --duration 2s --rate 50kHz --format pcm16 -o "$here/c4-ev-bay2.wav"

# C5: heat pump outdoor unit, inverter compressor at 30 Hz with 3 mA smooth DC; the logger ran at 20 kS/s for 10 s.
wavecheck synth composite:rms=8mA,motor=30Hz,switch=1kHz dc:level=3mA noise:rms=0.05mA,seed=5 \
  --duration 10s --rate 20kHz --format pcm16 -o "$here/c5-heat-pump.wav"

# C6: office lighting with phase-cut dimmers at 90°, exported by the logger as CSV at 10 kS/s.
wavecheck synth halfwave:peak=12mA,angle=90 noise:rms=0.02mA,seed=6 \
  --duration 1s --rate 10kHz -o "$here/c6-office-dimmers.csv"

# C7: spray-booth extraction fan on a single-phase drive (composite current, 7 mA) on its own 30 mA type F device.
# At 1.2 s the fan and the booth lighting switch on together: their EMC filters charge, a surge of 62 mA decaying with
# 30 ms. At 4.2 s the booth's heater element switches in with a leak to earth: 38 mA more for 400 ms. 6 s at 50 kS/s.
wavecheck synth composite:rms=7mA,motor=25Hz,switch=1kHz surge:rms=62mA,start=1.2s,duration=150ms,decay=30ms \
  surge:rms=38mA,start=4.2s,duration=400ms noise:rms=0.05mA,seed=7 \
  --duration 6s --rate 50kHz --format pcm16 -o "$here/c7-spray-booth.wav"

ls -l "$here"/*.wav "$here"/*.csv
