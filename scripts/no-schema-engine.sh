#!/bin/sh
# Stands in for Prisma's native schema engine, which cannot be downloaded here.
# `prisma generate|validate|format` only need this file to exist; migrations run through scripts/prisma-offline.mjs.
echo "The native Prisma schema engine is not available offline: use 'node scripts/prisma-offline.mjs' (see DEVELOPERS.md)." >&2
exit 1
