"""Developer aid: keep only the statements about the named tables in a generated migration, for when
several features add tables at once (DEVELOPERS.md): python3 scripts/lib/keep-own-tables.py FILE table ..."""
import re, sys
path, mine = sys.argv[1], sys.argv[2:]
s = open(path).read()
head, rest = s.split('public async up(queryRunner: QueryRunner): Promise<void> {', 1)
up, down = rest.split('public async down(queryRunner: QueryRunner): Promise<void> {', 1)
def keep(block):
    out = []
    for x in re.findall(r'        await queryRunner\.query\(`.*?`\);\n', block, re.S):
        m = re.search(r'(?:CREATE TABLE|ALTER TABLE|DROP TABLE|ON)\s+"([a-z_]+)"', x)
        idx = re.search(r'DROP INDEX "public"\."([a-z_]+)"', x)
        if (m and m.group(1) in mine) or (idx and any(idx.group(1).startswith(t) for t in mine)):
            out.append(x)
    return ''.join(out)
open(path, 'w').write(head + 'public async up(queryRunner: QueryRunner): Promise<void> {\n' + keep(up) +
    '    }\n\n    public async down(queryRunner: QueryRunner): Promise<void> {\n' + keep(down) + '    }\n\n}\n')
