#!/usr/bin/env bash
# fetch-hyparquet.sh CACHE_DIR: put the pinned version of the npm package
# hyparquet (MIT licence, no dependencies) into CACHE_DIR/hyparquet and print
# that directory. TestParquetReadByHyparquet (internal/report) reads our
# Parquet files with it, run by Node, as an independent reader.
#
# The tarball comes from the npm registry and is checked against the SHA-512
# pinned here before anything is unpacked; a cached copy of the same version
# is reused. Nothing is vendored into the repository.
set -euo pipefail

version=1.33.0
# sha512sum of hyparquet-1.33.0.tgz; the registry's dist.integrity is
# sha512-8EKLe73vRIMEKVEOe5y+kIzFxo6AvbLvd5ukd7P+yv3RvG0+TZM4qO8imbqxU6zds5pV+OeWRTMwy95mhHUheg==
# (the same digest in base64).
sha512=f0428b7bbdef44830429510e7b9cbe908cc5c68e80bdb2ef779ba477b3fecafdd1bc6d3e4d9338a8ef2299bab153acddb39a55f8e796453330cbde668475217a
url=https://registry.npmjs.org/hyparquet/-/hyparquet-$version.tgz

if [ $# -ne 1 ] || [ -z "$1" ]; then
  echo "usage: $0 CACHE_DIR" >&2
  exit 2
fi
cache=$1
dest=$cache/hyparquet
if [ -f "$dest/package.json" ] && grep -q "\"version\": \"$version\"" "$dest/package.json"; then
  echo "$dest"
  exit 0
fi

mkdir -p "$cache"
tmp=$(mktemp -d "$cache/.hyparquet.XXXXXX")
trap 'rm -rf "$tmp"' EXIT
curl -fsSL --retry 3 --max-time 120 -o "$tmp/hyparquet.tgz" "$url"
got=$(sha512sum "$tmp/hyparquet.tgz" | cut -d' ' -f1)
if [ "$got" != "$sha512" ]; then
  echo "hyparquet-$version.tgz: sha512 $got, want $sha512" >&2
  exit 1
fi
mkdir "$tmp/unpacked"
tar -xzf "$tmp/hyparquet.tgz" -C "$tmp/unpacked" --no-same-owner
# npm tarballs hold one directory, package/.
rm -rf "$dest"
mv "$tmp/unpacked/package" "$dest"
echo "$dest"
