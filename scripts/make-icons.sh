#!/usr/bin/env bash
# Make the PNG app icons from public/icon.svg (run by hand after changing the SVG; the PNGs are committed).
# Needs ImageMagick at development time only: apt-get install -y imagemagick.
set -euo pipefail
cd "$(dirname "$0")/../public"
CONVERT=${CONVERT:-/usr/bin/convert}
"$CONVERT" -background none -density 384 icon.svg -resize 192x192 icon-192.png
"$CONVERT" -background none -density 768 icon.svg -resize 512x512 icon-512.png
# Maskable: full-bleed square, the drawing shrunk into the central safe zone (a circle of 80 % of the width).
sed -e 's/rx="96"//' -e 's|<path|<g transform="translate(256 256) scale(0.72) translate(-256 -256)"><path|' -e 's|</svg>|</g></svg>|' icon.svg > /tmp/glintmark-maskable.svg
# the background rect stays outside the scaled group
sed -i 's|<g transform="translate(256 256) scale(0.72) translate(-256 -256)"><path|<g transform="translate(256 256) scale(0.72) translate(-256 -256)"><path|' /tmp/glintmark-maskable.svg
"$CONVERT" -background none -density 768 /tmp/glintmark-maskable.svg -resize 512x512 icon-maskable-512.png
# Apple touch icon: 180 px, opaque (iOS rounds the corners itself).
"$CONVERT" -background '#003d99' -density 384 /tmp/glintmark-maskable.svg -resize 180x180 -flatten apple-touch-icon.png
