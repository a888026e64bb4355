#!/usr/bin/env bash
# Remake the small audio fixtures of the measurement-engine tests (tests/fixtures/audio).
# Needs sox with its mp3/ogg writers (Debian: apt-get install sox libsox-fmt-all) and flac.
# The tests themselves never call sox; they read the committed files.
#
# Every fixture is the same kind of strike: a 440 Hz partial and a 1212.86 Hz partial
# (440 × 2.7565, the second free–free beam mode), with a fast rise and a fade-out,
# 50 ms of silence before it, sine phases fixed so the files are reproducible.
set -euo pipefail
cd "$(dirname "$0")/../tests/fixtures/audio"

strike() { # rate seconds output [sox output options...]
  local rate=$1 seconds=$2 out=$3
  shift 3
  sox -n -r "$rate" -c 1 "$@" "$out" \
    synth "$seconds" sine 440 sine 1212.86 remix - gain -8 \
    fade q 0.002 "$seconds" "$(awk "BEGIN{print $seconds*0.7}")" pad 0.05 0
}

strike 44100 0.6 strike-44k1-24bit.wav -b 24 -e signed-integer
strike 44100 0.45 strike-44k1-float.wav -b 32 -e floating-point
strike 48000 0.8 strike-48k-16bit.wav -b 16 -e signed-integer --no-dither
# The same strike as AIFF (sample for sample the WAV above) and as AIFF-C at 24 bits.
strike 48000 0.8 strike-48k-16bit.aiff -b 16 -e signed-integer --no-dither
strike 44100 0.6 strike-44k1-24bit.aifc -b 24 -e signed-integer
strike 48000 1.0 strike-48k.flac -b 16 -C 8
strike 96000 0.5 strike-96k.flac -b 24 -C 8
strike 44100 1.0 strike-44k1.mp3 -C 128
strike 48000 1.0 strike-48k.ogg -C 4

# Damaged files for the bad-input tests.
head -c 3000 strike-48k.flac > truncated.flac
head -c 40 strike-48k-16bit.wav > truncated-header.wav
head -c 30000 strike-48k-16bit.aiff > truncated.aiff
head -c 30 strike-48k-16bit.aiff > truncated-header.aiff
printf 'Tonewright test: this file is plain text, not audio.\n' > not-audio.txt
: > empty.wav
ls -l
