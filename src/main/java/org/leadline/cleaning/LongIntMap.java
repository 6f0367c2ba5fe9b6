package org.leadline.cleaning;

/**
 * Open-addressing hash map from long keys to int values, without boxing; used to number the
 * along-track series and the occupied cells of the provisional surface compactly.
 */
final class LongIntMap {
    private long[] keys;
    private int[] values;
    private boolean[] used;
    private int size;
    private int mask;

    LongIntMap(int expected) {
        int cap = Integer.highestOneBit(Math.max(8, expected) * 2 - 1) << 1;
        alloc(cap);
    }

    private void alloc(int cap) {
        keys = new long[cap];
        values = new int[cap];
        used = new boolean[cap];
        mask = cap - 1;
    }

    int size() { return size; }

    private static int hash(long k) {
        // MurmurHash3 64-bit finaliser (Appleby 2011): spreads packed (x, y) cell keys
        k ^= k >>> 33;
        k *= 0xff51afd7ed558ccdL;
        k ^= k >>> 33;
        k *= 0xc4ceb9fe1a85ec53L;
        k ^= k >>> 33;
        return (int) k;
    }

    /** The value of key k, or -1 when absent. */
    int get(long k) {
        int h = hash(k) & mask;
        while (used[h]) {
            if (keys[h] == k) return values[h];
            h = (h + 1) & mask;
        }
        return -1;
    }

    /** The value of key k; when absent, stores v and returns it. */
    int putIfAbsent(long k, int v) {
        int h = hash(k) & mask;
        while (used[h]) {
            if (keys[h] == k) return values[h];
            h = (h + 1) & mask;
        }
        used[h] = true;
        keys[h] = k;
        values[h] = v;
        if (++size * 2 > keys.length) rehash();
        return v;
    }

    private void rehash() {
        long[] k = keys;
        int[] v = values;
        boolean[] u = used;
        alloc(keys.length * 2);
        size = 0;
        for (int i = 0; i < k.length; i++) if (u[i]) putIfAbsent(k[i], v[i]);
    }
}
