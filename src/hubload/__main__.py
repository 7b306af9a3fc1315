from hubload.cli import main

main()
